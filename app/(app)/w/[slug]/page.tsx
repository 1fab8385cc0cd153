import type { Metadata } from "next";
import Link from "next/link";
import { VerdictBadge } from "@/components/ui/verdict-badge";
import { describeAuditEvent } from "@/components/workspace/audit-text";
import { listAuditEvents } from "@/lib/data/audit-events";
import { listMembers } from "@/lib/data/members";
import { getWorkspaceOverview } from "@/lib/data/overview";
import { requireWorkspacePage } from "@/lib/guard";
import { allowedActions } from "@/lib/permissions";
import { ACTION_WORDS } from "@/lib/permission-words";
import { ROLE_SUMMARIES } from "@/lib/roles";

export const metadata: Metadata = { title: "Overview" };

function Figure({ label, value, href, tone }: { label: string; value: number; href?: string; tone?: string }) {
  const body = (
    <>
      <span className={`block font-display text-3xl ${tone ?? ""}`}>{value}</span>
      <span className="text-sm text-chart-muted">{label}</span>
    </>
  );
  return href ? (
    <Link href={href} className="rounded-lg p-2 hover:bg-chart-paper">
      {body}
    </Link>
  ) : (
    <div className="p-2">{body}</div>
  );
}

export default async function WorkspaceOverviewPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { access, can } = await requireWorkspacePage(slug);
  const base = `/w/${slug}`;
  const [overview, members, events] = await Promise.all([
    can("run.view")
      ? getWorkspaceOverview(access.workspace.id, { sharedOnly: access.role === "student", withVehicles: can("vehicle.view") })
      : null,
    can("member.list") ? listMembers(access.workspace.id) : null,
    can("audit.view") ? listAuditEvents(access.workspace.id, 6) : null,
  ]);
  const actions = allowedActions(access.role);
  return (
    <div className="grid gap-6 lg:grid-cols-3">
      {overview ? (
        <section className="card p-6 lg:col-span-2" aria-labelledby="state-heading">
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <h2 id="state-heading" className="text-lg font-semibold">
              Calibrations, last 90 days
            </h2>
            {can("run.create") ? (
              <Link href={`${base}/runs/new`} className="btn-primary">
                Start a run
              </Link>
            ) : null}
          </div>
          <div className="mt-3 grid grid-cols-2 gap-2 sm:grid-cols-5">
            <Figure
              label="passed"
              value={overview.recentVerdicts.pass}
              href={`${base}/runs?verdict=pass`}
              tone="text-steady-ink dark:text-emerald-300"
            />
            <Figure
              label="with warnings"
              value={overview.recentVerdicts.warn}
              href={`${base}/runs?verdict=warn`}
              tone="text-heed-ink dark:text-amber-300"
            />
            <Figure
              label="failed"
              value={overview.recentVerdicts.fail}
              href={`${base}/runs?verdict=fail`}
              tone="text-halt dark:text-red-300"
            />
            {access.role !== "student" ? <Figure label="awaiting sign-off" value={overview.awaitingSignOff} href={`${base}/runs`} /> : null}
            {can("vehicle.view") ? <Figure label="vehicles in service" value={overview.vehicleCount} href={`${base}/vehicles`} /> : null}
          </div>
          <h3 className="mt-5 text-sm font-semibold uppercase tracking-wide text-chart-muted">Latest runs</h3>
          {overview.latestRuns.length === 0 ? (
            <p className="mt-2 text-sm text-chart-muted">No runs yet{can("run.create") ? ": start one from a calibration log." : "."}</p>
          ) : (
            <ul className="mt-2 divide-y divide-chart-rule">
              {overview.latestRuns.map((run) => (
                <li key={run.id} className="flex items-center justify-between gap-3 py-2 text-sm">
                  <Link href={`${base}/runs/${run.id}`} className="link min-w-0 truncate">
                    {run.vehicleName} · {run.title || run.fileName}
                  </Link>
                  <span className="flex shrink-0 items-center gap-3">
                    <span className="font-mono text-xs text-chart-muted">{run.capturedOn}</span>
                    {run.verdict ? <VerdictBadge verdict={run.verdict} /> : <span className="text-xs text-chart-muted">{run.status}</span>}
                  </span>
                </li>
              ))}
            </ul>
          )}
        </section>
      ) : null}
      <section className="card p-6" aria-labelledby="role-heading">
        <h2 id="role-heading" className="text-lg font-semibold">
          What your role opens
        </h2>
        <p className="mt-1 text-chart-muted">{ROLE_SUMMARIES[access.role]}</p>
        <ul className="mt-3 list-disc space-y-0.5 pl-5 text-sm" aria-label="Permitted actions">
          {actions.map((a) => (
            <li key={a}>{ACTION_WORDS[a]}</li>
          ))}
        </ul>
        {members ? (
          <p className="mt-4 text-sm">
            <Link href={`${base}/members`} className="link">
              {members.length} {members.length === 1 ? "person" : "people"} in this workspace
            </Link>
          </p>
        ) : null}
      </section>
      {events ? (
        <section className="card p-6 lg:col-span-3" aria-labelledby="recent-heading">
          <h2 id="recent-heading" className="text-lg font-semibold">
            Latest in the logbook
          </h2>
          <ul className="mt-3 divide-y divide-chart-rule">
            {events.map((e) => (
              <li key={e.id} className="flex justify-between gap-4 py-2 text-sm">
                <span>{describeAuditEvent(e)}</span>
                <time className="shrink-0 font-mono text-xs text-chart-muted" dateTime={e.createdAt}>
                  {e.createdAt.slice(0, 16).replace("T", " ")}
                </time>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}
