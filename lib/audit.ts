import "server-only";
import type { Transaction } from "sequelize";
import { db } from "@/lib/db";

export interface AuditInput {
  workspaceId?: string | null;
  actorId?: string | null;
  action: string;
  targetType?: string;
  targetId?: string;
  detail?: Record<string, unknown>;
  ipAddress?: string | null;
}

/** Append one event to the audit trail (inside the caller's transaction when given). */
export async function recordAudit(event: AuditInput, transaction?: Transaction): Promise<void> {
  await db().models.AuditEvent.create(
    {
      workspaceId: event.workspaceId ?? null,
      actorId: event.actorId ?? null,
      action: event.action,
      targetType: event.targetType ?? null,
      targetId: event.targetId ?? null,
      detail: event.detail ?? {},
      ipAddress: event.ipAddress ?? null,
    },
    { transaction },
  );
}
