import "server-only";
import { QueryTypes } from "sequelize";
import { db } from "@/lib/db";
import { listRuns, type RunSummary } from "@/lib/data/runs";

export interface WorkspaceOverview {
  vehicleCount: number;
  /** Finished runs of the last 90 days by verdict. */
  recentVerdicts: { pass: number; warn: number; fail: number };
  /** Finished runs that nobody has signed off yet. */
  awaitingSignOff: number;
  latestRuns: RunSummary[];
}

/** The workspace at a glance; students see only what is shared with them. */
export async function getWorkspaceOverview(
  workspaceId: string,
  options: { sharedOnly: boolean; withVehicles: boolean },
): Promise<WorkspaceOverview> {
  const { sequelize, models } = db();
  const shared = options.sharedOnly ? "AND shared_with_students" : "";
  const [counts] = await sequelize.query<{ pass: string; warn: string; fail: string; awaiting: string }>(
    `SELECT count(*) FILTER (WHERE verdict = 'pass' AND captured_on >= now() - interval '90 days') AS pass,
            count(*) FILTER (WHERE verdict = 'warn' AND captured_on >= now() - interval '90 days') AS warn,
            count(*) FILTER (WHERE verdict = 'fail' AND captured_on >= now() - interval '90 days') AS fail,
            count(*) FILTER (WHERE status = 'done' AND signed_off_at IS NULL) AS awaiting
       FROM runs WHERE workspace_id = :workspaceId AND deleted_at IS NULL ${shared}`,
    { replacements: { workspaceId }, type: QueryTypes.SELECT },
  );
  const latest = await listRuns(
    workspaceId,
    { sort: "createdAt", order: "desc", page: 1, pageSize: 5 },
    { sharedOnly: options.sharedOnly },
  );
  return {
    vehicleCount: options.withVehicles ? await models.Vehicle.count({ where: { workspaceId, archived: false } }) : 0,
    recentVerdicts: { pass: Number(counts.pass), warn: Number(counts.warn), fail: Number(counts.fail) },
    awaitingSignOff: Number(counts.awaiting),
    latestRuns: latest.items,
  };
}
