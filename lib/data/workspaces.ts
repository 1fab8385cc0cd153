import "server-only";
import { UniqueConstraintError } from "sequelize";
import { recordAudit } from "@/lib/audit";
import { db } from "@/lib/db";
import type { Role, WorkspaceKind } from "@/lib/roles";
import type { Workspace } from "@/models";

export interface WorkspaceSummary {
  id: string;
  slug: string;
  name: string;
  kind: WorkspaceKind;
}

/** What the current user is in one workspace. */
export interface WorkspaceAccess {
  workspace: WorkspaceSummary;
  role: Role;
  membershipId: string;
}

function toSummary(w: Workspace): WorkspaceSummary {
  return { id: w.id, slug: w.slug, name: w.name, kind: w.kind };
}

export class SlugTakenError extends Error {
  constructor() {
    super("That address is taken; choose another.");
  }
}

/** Create a workspace with its creator as owner, in one transaction. */
export async function createWorkspace(
  ownerId: string,
  input: { name: string; slug: string; kind: WorkspaceKind },
): Promise<WorkspaceSummary> {
  const { sequelize, models } = db();
  try {
    return await sequelize.transaction(async (transaction) => {
      const workspace = await models.Workspace.create(input, { transaction });
      await models.Membership.create({ workspaceId: workspace.id, userId: ownerId, role: "owner" }, { transaction });
      await recordAudit(
        { workspaceId: workspace.id, actorId: ownerId, action: "workspace.created", targetType: "workspace", targetId: workspace.id },
        transaction,
      );
      return toSummary(workspace);
    });
  } catch (error) {
    if (error instanceof UniqueConstraintError) throw new SlugTakenError();
    throw error;
  }
}

export async function listWorkspacesForUser(userId: string): Promise<(WorkspaceSummary & { role: Role })[]> {
  const { Membership, Workspace } = db().models;
  const memberships = await Membership.findAll({
    where: { userId },
    include: [{ model: Workspace, as: "workspace", required: true }],
    order: [["createdAt", "ASC"]],
  });
  return memberships.map((m) => ({
    ...toSummary((m as unknown as { workspace: Workspace }).workspace),
    role: m.role,
  }));
}

/** The user's access to the workspace at `slug`, or null when they are not a member (or it does not exist). */
export async function getWorkspaceAccess(userId: string, slug: string): Promise<WorkspaceAccess | null> {
  const { Membership, Workspace } = db().models;
  const workspace = await Workspace.findOne({ where: { slug } });
  if (!workspace) return null;
  const membership = await Membership.findOne({ where: { workspaceId: workspace.id, userId } });
  if (!membership) return null;
  return { workspace: toSummary(workspace), role: membership.role, membershipId: membership.id };
}

export async function updateWorkspace(
  workspaceId: string,
  actorId: string,
  input: { name: string; kind: WorkspaceKind },
): Promise<WorkspaceSummary> {
  const { sequelize, models } = db();
  return sequelize.transaction(async (transaction) => {
    const workspace = await models.Workspace.findByPk(workspaceId, { transaction, rejectOnEmpty: true });
    await workspace.update(input, { transaction });
    await recordAudit({ workspaceId, actorId, action: "workspace.updated", detail: input }, transaction);
    return toSummary(workspace);
  });
}
