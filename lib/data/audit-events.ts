import "server-only";
import { db } from "@/lib/db";
import type { User } from "@/models";

export interface AuditEntry {
  id: string;
  action: string;
  actorName: string | null;
  targetType: string | null;
  targetId: string | null;
  detail: Record<string, unknown>;
  createdAt: string;
}

export async function listAuditEvents(workspaceId: string, limit = 100): Promise<AuditEntry[]> {
  const rows = await db().models.AuditEvent.findAll({
    where: { workspaceId },
    include: [{ model: db().models.User, as: "actor", required: false }],
    order: [
      ["createdAt", "DESC"],
      ["id", "DESC"],
    ],
    limit,
  });
  return rows.map((e) => ({
    id: String(e.id),
    action: e.action,
    actorName: (e as unknown as { actor: User | null }).actor?.name ?? null,
    targetType: e.targetType,
    targetId: e.targetId,
    detail: e.detail,
    createdAt: e.createdAt.toISOString(),
  }));
}
