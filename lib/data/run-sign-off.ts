import "server-only";
import { recordAudit } from "@/lib/audit";
import { db } from "@/lib/db";
import { UserFacingError } from "@/lib/errors";

/**
 * Sign off the version of a run that the technician looked at. The version must be the run's
 * current one and finished; signing records who, when, the comment and the verdict in the
 * logbook. A signed-off run cannot be deleted; re-processing it makes a new, unsigned version.
 */
export async function signOffRun(workspaceId: string, actorId: string, runId: string, versionId: string, comment: string): Promise<void> {
  const { sequelize, models } = db();
  await sequelize.transaction(async (transaction) => {
    const run = await models.Run.findOne({ where: { workspaceId, id: runId }, transaction, lock: true });
    if (!run) throw new UserFacingError("Run not found.");
    if (run.currentVersionId !== versionId) throw new UserFacingError("A newer version of this run exists: review it before signing off.");
    const version = await models.RunVersion.findByPk(versionId, { transaction });
    if (!version || version.status !== "done") throw new UserFacingError("Only a finished run can be signed off.");
    if (run.signedOffVersionId === versionId) throw new UserFacingError("This version is already signed off.");
    await run.update(
      { signedOffAt: new Date(), signedOffById: actorId, signOffComment: comment || null, signedOffVersionId: versionId },
      { transaction },
    );
    await recordAudit(
      {
        workspaceId,
        actorId,
        action: "run.signed-off",
        targetType: "run",
        targetId: runId,
        detail: { version: version.number, verdict: version.verdict, comment: comment || null, file: run.fileName },
      },
      transaction,
    );
  });
}
