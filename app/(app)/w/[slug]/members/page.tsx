import type { Metadata } from "next";
import { InviteForm } from "@/components/members/invite-form";
import { RemoveMemberButton, RevokeInvitationButton, RoleSelect } from "@/components/members/member-controls";
import { listOpenInvitations } from "@/lib/data/invitations";
import { listMembers } from "@/lib/data/members";
import { requireWorkspacePage } from "@/lib/guard";
import { assignableRoles } from "@/lib/permissions";
import { ROLE_LABELS } from "@/lib/roles";
import { TableHead } from "@/components/ui/table-head";

export const metadata: Metadata = { title: "People" };

export default async function MembersPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { viewer, access, can } = await requireWorkspacePage(slug, "member.list");
  const members = await listMembers(access.workspace.id);
  const mayInvite = can("member.invite");
  const mayChangeRole = can("member.change-role");
  const mayRemove = can("member.remove");
  const invitations = mayInvite ? await listOpenInvitations(access.workspace.id) : [];
  return (
    <div className="grid items-start gap-6 lg:grid-cols-[1fr_22rem]">
      <section className="card overflow-hidden" aria-labelledby="members-heading">
        <h2 id="members-heading" className="px-6 pt-6 text-lg font-semibold">
          People in {access.workspace.name}
        </h2>
        <table className="mt-4 w-full text-left text-sm">
          <TableHead columns={["Name", "Role"]} actions={mayRemove} padding="px-6" />
          <tbody className="divide-y divide-chart-rule">
            {members.map((m) => (
              <tr key={m.membershipId} data-testid="member-row">
                <td className="px-6 py-3">
                  <p className="font-medium">{m.name}</p>
                  <p className="text-xs text-chart-muted">{m.email}</p>
                </td>
                <td className="px-6 py-3">
                  {mayChangeRole && m.userId !== viewer.id ? (
                    <RoleSelect workspace={slug} membershipId={m.membershipId} role={m.role} name={m.name} />
                  ) : (
                    <span>{ROLE_LABELS[m.role]}</span>
                  )}
                </td>
                {mayRemove ? (
                  <td className="px-6 py-3 text-right">
                    {m.userId !== viewer.id ? <RemoveMemberButton workspace={slug} membershipId={m.membershipId} name={m.name} /> : null}
                  </td>
                ) : null}
              </tr>
            ))}
          </tbody>
        </table>
      </section>
      {mayInvite ? (
        <aside className="space-y-6">
          <section className="card p-6" aria-labelledby="invite-heading">
            <h2 id="invite-heading" className="mb-4 text-lg font-semibold">
              Invite someone
            </h2>
            <InviteForm workspace={slug} roles={assignableRoles(access.role)} />
          </section>
          {invitations.length > 0 ? (
            <section className="card p-6" aria-labelledby="pending-heading">
              <h2 id="pending-heading" className="text-lg font-semibold">
                Waiting for an answer
              </h2>
              <ul className="mt-3 divide-y divide-chart-rule text-sm">
                {invitations.map((i) => (
                  <li key={i.id} className="flex items-center justify-between gap-2 py-2">
                    <span>
                      {i.email} <span className="text-chart-muted">· {ROLE_LABELS[i.role]}</span>
                    </span>
                    <RevokeInvitationButton workspace={slug} invitationId={i.id} />
                  </li>
                ))}
              </ul>
            </section>
          ) : null}
        </aside>
      ) : null}
    </div>
  );
}
