import Link from "next/link";
import type { RunVersionSummary } from "@/lib/data/runs";
import { MODEL_CHOICE_LABELS } from "@/lib/fleet-terms";

/** Every processing of the run, newest first; each keeps its own results. */
export function VersionList({
  versions,
  currentId,
  signedOffId,
}: {
  versions: RunVersionSummary[];
  currentId: string | null;
  signedOffId: string | null;
}) {
  if (versions.length < 2) return null;
  return (
    <section className="card p-5" aria-labelledby="versions-heading">
      <h2 id="versions-heading" className="text-lg font-semibold">
        Versions
      </h2>
      <ul className="mt-2 space-y-1 text-sm">
        {versions.map((v) => (
          <li key={v.id}>
            <Link
              href={`?version=${v.id}`}
              className={v.id === currentId ? "font-semibold" : "link"}
              aria-current={v.id === currentId ? "true" : undefined}
            >
              Version {v.number}
            </Link>{" "}
            <span className="text-chart-muted">
              · {MODEL_CHOICE_LABELS[v.modelChoice]}
              {v.site ? ` · ${v.site.name}` : " · no site"} · {v.status === "done" ? (v.verdict ?? "done") : v.status}
              {v.id === signedOffId ? " · signed off" : ""}
            </span>
          </li>
        ))}
      </ul>
    </section>
  );
}
