import type { AuditEntry } from "@/lib/data/audit-events";

const VERBS: Record<string, string> = {
  "workspace.created": "created the workspace",
  "workspace.updated": "changed the workspace settings",
  "member.invited": "invited",
  "member.joined": "joined",
  "member.role-changed": "changed a role",
  "member.removed": "removed a member",
  "invitation.revoked": "withdrew an invitation for",
};

/** One readable line for an audit event. */
export function describeAuditEvent(event: AuditEntry): string {
  if (!event.actorName && (event.detail as { seeded?: boolean }).seeded) return "Demo workspace prepared";
  const who = event.actorName ?? "Someone";
  const verb = VERBS[event.action] ?? event.action;
  const detail = event.detail as Record<string, string | undefined>;
  switch (event.action) {
    case "member.invited":
      return `${who} ${verb} ${detail.email} as ${detail.role}`;
    case "member.joined":
      return `${who} ${verb} as ${detail.role}`;
    case "member.role-changed":
      return `${who} ${verb}: ${detail.from} → ${detail.to}`;
    case "invitation.revoked":
      return `${who} ${verb} ${detail.email}`;
    default:
      return `${who} ${verb}`;
  }
}
