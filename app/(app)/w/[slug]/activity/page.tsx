import type { Metadata } from "next";
import { listAuditEvents } from "@/lib/data/audit-events";
import { requireWorkspacePage } from "@/lib/guard";
import { describeAuditEvent } from "@/components/workspace/audit-text";

export const metadata: Metadata = { title: "Logbook" };

export default async function ActivityPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { access } = await requireWorkspacePage(slug, "audit.view");
  const events = await listAuditEvents(access.workspace.id, 200);
  return (
    <section className="card p-6">
      <h2 className="text-lg font-semibold">Logbook</h2>
      <p className="text-sm text-chart-muted">Every change to this workspace, newest first. Entries cannot be edited.</p>
      <table className="mt-4 w-full text-left text-sm">
        <thead className="text-xs uppercase tracking-wide text-chart-muted">
          <tr>
            <th className="py-2 font-medium">When (UTC)</th>
            <th className="py-2 font-medium">What</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-chart-rule">
          {events.map((e) => (
            <tr key={e.id}>
              <td className="py-2 pr-4 font-mono text-xs text-chart-muted">{e.createdAt.slice(0, 19).replace("T", " ")}</td>
              <td className="py-2">{describeAuditEvent(e)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </section>
  );
}
