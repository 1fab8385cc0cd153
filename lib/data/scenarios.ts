import "server-only";
import { Op, UniqueConstraintError } from "sequelize";
import type { ScenarioSpec } from "@/geometry/scenario";
import { recordAudit } from "@/lib/audit";
import { db } from "@/lib/db";
import { UserFacingError } from "@/lib/errors";
import type { ScenarioInput, ScenarioUpdate } from "@/lib/validations/classroom";
import type { Scenario } from "@/models";

/** A teaching scenario as the pages and the API see it. */
export interface ScenarioSummary {
  id: string;
  name: string;
  description: string;
  answer: string;
  readyMade: boolean;
  spec: ScenarioSpec;
  createdAt: string;
}

function toSummary(s: Scenario): ScenarioSummary {
  return {
    id: s.id,
    name: s.name,
    description: s.description,
    answer: s.answer,
    readyMade: s.readyMade,
    spec: s.spec,
    createdAt: s.createdAt.toISOString(),
  };
}

const NAME_TAKEN = "A scenario with that name already exists in this workspace.";

/** The workspace's scenarios: the ready-made ones first, then by name. */
export async function listScenarios(workspaceId: string): Promise<ScenarioSummary[]> {
  const rows = await db().models.Scenario.findAll({
    where: { workspaceId },
    order: [
      ["readyMade", "DESC"],
      ["name", "ASC"],
    ],
  });
  return rows.map(toSummary);
}

/** One scenario of this workspace, or null (another workspace's scenario is never found). */
export async function getScenario(workspaceId: string, id: string): Promise<ScenarioSummary | null> {
  const row = await db().models.Scenario.findOne({ where: { workspaceId, id } });
  return row ? toSummary(row) : null;
}

export async function createScenario(
  workspaceId: string,
  actorId: string | null,
  input: ScenarioInput,
  options: { readyMade?: boolean } = {},
): Promise<ScenarioSummary> {
  const { sequelize, models } = db();
  try {
    return await sequelize.transaction(async (transaction) => {
      const row = await models.Scenario.create(
        { workspaceId, createdById: actorId, readyMade: options.readyMade ?? false, ...input },
        { transaction },
      );
      await recordAudit(
        { workspaceId, actorId, action: "scenario.created", targetType: "scenario", targetId: row.id, detail: { name: row.name } },
        transaction,
      );
      return toSummary(row);
    });
  } catch (error) {
    if (error instanceof UniqueConstraintError) throw new UserFacingError(NAME_TAKEN, "name");
    throw error;
  }
}

/** Change the fields given; the others keep their value. Null when the scenario is not in this workspace. */
export async function updateScenario(
  workspaceId: string,
  actorId: string,
  id: string,
  patch: ScenarioUpdate,
): Promise<ScenarioSummary | null> {
  const { sequelize, models } = db();
  try {
    return await sequelize.transaction(async (transaction) => {
      const row = await models.Scenario.findOne({ where: { workspaceId, id }, transaction, lock: true });
      if (!row) return null;
      const changes = Object.fromEntries(Object.entries(patch).filter(([, value]) => value !== undefined));
      await row.update(changes, { transaction });
      await recordAudit(
        {
          workspaceId,
          actorId,
          action: "scenario.updated",
          targetType: "scenario",
          targetId: row.id,
          detail: { fields: Object.keys(changes) },
        },
        transaction,
      );
      return toSummary(row);
    });
  } catch (error) {
    if (error instanceof UniqueConstraintError) throw new UserFacingError(NAME_TAKEN, "name");
    throw error;
  }
}

/** Delete a scenario. Sessions started from it keep their own copy and run on. */
export async function deleteScenario(workspaceId: string, actorId: string, id: string): Promise<boolean> {
  const { sequelize, models } = db();
  return sequelize.transaction(async (transaction) => {
    const row = await models.Scenario.findOne({ where: { workspaceId, id }, transaction });
    if (!row) return false;
    await row.destroy({ transaction });
    await recordAudit(
      { workspaceId, actorId, action: "scenario.deleted", targetType: "scenario", targetId: id, detail: { name: row.name } },
      transaction,
    );
    return true;
  });
}

/** A copy named "… (copy)" (or "… (copy 2)", … when taken), never ready-made. */
export async function duplicateScenario(workspaceId: string, actorId: string, id: string): Promise<ScenarioSummary | null> {
  const { models } = db();
  const source = await models.Scenario.findOne({ where: { workspaceId, id } });
  if (!source) return null;
  const stem = `${source.name.slice(0, 100)} (copy`;
  const taken = new Set(
    (await models.Scenario.findAll({ where: { workspaceId, name: { [Op.startsWith]: stem } }, attributes: ["name"] })).map((s) => s.name),
  );
  let name = `${stem})`;
  for (let n = 2; taken.has(name); n++) name = `${stem} ${n})`;
  return createScenario(workspaceId, actorId, { name, description: source.description, answer: source.answer, spec: source.spec });
}
