import { mountingRotationById } from "@/geometry/mounting-rotations";
import type { AuditEntry } from "@/lib/data/audit-events";

type Detail = Record<string, string | number | null | undefined>;

/** A mounting id in short words ("x → right, z → down"); anything else as written. */
const mounting = (value: Detail[string]) => mountingRotationById(String(value))?.shortWords ?? String(value);

/** One readable line per kind of event; unknown kinds fall back to their name. */
const LINES: Record<string, (who: string, d: Detail) => string> = {
  "workspace.created": (who) => `${who} created the workspace`,
  "workspace.updated": (who) => `${who} changed the workspace settings`,
  "member.invited": (who, d) => `${who} invited ${d.email} as ${d.role}`,
  "member.joined": (who, d) => `${who} joined as ${d.role}`,
  "member.role-changed": (who, d) => `${who} changed a role: ${d.from} → ${d.to}`,
  "member.removed": (who) => `${who} removed a member`,
  "invitation.revoked": (who, d) => `${who} withdrew an invitation for ${d.email}`,
  "site.created": (who, d) => `${who} added the site ${d.name}`,
  "site.updated": (who, d) => `${who} edited the site ${d.name}`,
  "vehicle.created": (who, d) => `${who} added the vehicle ${d.name}`,
  "vehicle.updated": (who, d) => `${who} edited the vehicle ${d.name}`,
  "vehicle.archived": (who, d) => `${who} archived the vehicle ${d.name}`,
  "sensor.added": (who, d) => `${who} added the ${d.kind} “${d.label}”`,
  "sensor.updated": (who, d) =>
    d.mountingTo !== undefined
      ? `${who} changed the declared mounting of “${d.label}”: was ${mounting(d.mountingFrom)}; now ${mounting(d.mountingTo)}`
      : `${who} edited the sensor “${d.label}”`,
  "run.created": (who, d) => `${who} started a run on ${d.vehicle} (${d.file})`,
  "run.reprocessed": (who, d) => `${who} processed a run again (version ${d.version}, model ${d.model})`,
  "run.signed-off": (who, d) => `${who} signed off ${d.file}, version ${d.version} (${d.verdict})`,
  "run.deleted": (who, d) => `${who} deleted the run ${d.file}`,
  "scenario.created": (who, d) => `${who} composed the scenario ${d.name ?? ""}`.trim(),
  "scenario.updated": (who, d) => `${who} edited the scenario ${d.name ?? ""}`.trim(),
  "scenario.deleted": (who, d) => `${who} deleted the scenario ${d.name ?? ""}`.trim(),
  "class-session.started": (who, d) => `${who} started a class session${d.scenario ? ` on “${d.scenario}”` : ""}`,
  "class-session.ended": (who) => `${who} ended a class session`,
};

export function describeAuditEvent(event: AuditEntry): string {
  const detail = event.detail as Detail & { seeded?: boolean };
  if (!event.actorName && detail.seeded) return "Demo workspace prepared";
  const who = event.actorName ?? "Someone";
  const line = LINES[event.action];
  return line ? line(who, detail) : `${who}: ${event.action}`;
}
