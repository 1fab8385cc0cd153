import type { Metadata } from "next";
import Link from "next/link";
import { listAuditEvents } from "@/lib/data/audit-events";
import { listMembers } from "@/lib/data/members";
import { requireWorkspacePage } from "@/lib/guard";
import { allowedActions } from "@/lib/permissions";
import { ROLE_SUMMARIES } from "@/lib/roles";
import { describeAuditEvent } from "@/components/workspace/audit-text";

export const metadata: Metadata = { title: "Overview" };

export default async function WorkspaceOverviewPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { access, can } = await requireWorkspacePage(slug);
  const members = can("member.list") ? await listMembers(access.workspace.id) : null;
  const events = can("audit.view") ? await listAuditEvents(access.workspace.id, 6) : null;
  const actions = allowedActions(access.role);
  return (
    <div className="grid gap-6 lg:grid-cols-3">
      <section className="card p-6 lg:col-span-2" aria-labelledby="role-heading">
        <h2 id="role-heading" className="text-lg font-semibold">
          What your role opens
        </h2>
        <p className="mt-1 text-chart-muted">{ROLE_SUMMARIES[access.role]}</p>
        <ul className="mt-4 flex flex-wrap gap-2" aria-label="Permitted actions">
          {actions.map((a) => (
            <li key={a} className="rounded-full border border-chart-rule px-2.5 py-0.5 font-mono text-xs text-chart-muted">
              {a}
            </li>
          ))}
        </ul>
      </section>
      {members ? (
        <section className="card p-6" aria-labelledby="people-heading">
          <h2 id="people-heading" className="text-lg font-semibold">
            People
          </h2>
          <p className="mt-1 font-display text-4xl">{members.length}</p>
          <Link href={`/w/${slug}/members`} className="link text-sm">
            See everyone
          </Link>
        </section>
      ) : null}
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
