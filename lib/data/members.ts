import "server-only";
import { recordAudit } from "@/lib/audit";
import { db } from "@/lib/db";
import type { Role } from "@/lib/roles";
import type { User } from "@/models";

export interface MemberSummary {
  membershipId: string;
  userId: string;
  name: string;
  email: string;
  role: Role;
  joinedAt: string;
}

export class MemberError extends Error {}

export async function listMembers(workspaceId: string): Promise<MemberSummary[]> {
  const { Membership, User: UserModel } = db().models;
  const rows = await Membership.findAll({
    where: { workspaceId },
    include: [{ model: UserModel, as: "user", required: true }],
    order: [["createdAt", "ASC"]],
  });
  return rows.map((m) => {
    const user = (m as unknown as { user: User }).user;
    return { membershipId: m.id, userId: user.id, name: user.name, email: user.email, role: m.role, joinedAt: m.createdAt.toISOString() };
  });
}

async function ownerCount(workspaceId: string): Promise<number> {
  return db().models.Membership.count({ where: { workspaceId, role: "owner" } });
}

/** Change a member's role; a workspace always keeps at least one owner. */
export async function changeMemberRole(workspaceId: string, actorId: string, membershipId: string, role: Role): Promise<void> {
  const { sequelize, models } = db();
  await sequelize.transaction(async (transaction) => {
    const membership = await models.Membership.findOne({ where: { id: membershipId, workspaceId }, transaction, lock: true });
    if (!membership) throw new MemberError("That member is not in this workspace.");
    if (membership.role === "owner" && role !== "owner" && (await ownerCount(workspaceId)) <= 1) {
      throw new MemberError("A workspace needs at least one owner: make someone else owner first.");
    }
    const from = membership.role;
    await membership.update({ role }, { transaction });
    await recordAudit(
      { workspaceId, actorId, action: "member.role-changed", targetType: "user", targetId: membership.userId, detail: { from, to: role } },
      transaction,
    );
  });
}

export async function removeMember(workspaceId: string, actorId: string, membershipId: string): Promise<void> {
  const { sequelize, models } = db();
  await sequelize.transaction(async (transaction) => {
    const membership = await models.Membership.findOne({ where: { id: membershipId, workspaceId }, transaction, lock: true });
    if (!membership) throw new MemberError("That member is not in this workspace.");
    if (membership.role === "owner" && (await ownerCount(workspaceId)) <= 1) {
      throw new MemberError("The last owner cannot be removed.");
    }
    await membership.destroy({ transaction });
    await recordAudit(
      {
        workspaceId,
        actorId,
        action: "member.removed",
        targetType: "user",
        targetId: membership.userId,
        detail: { role: membership.role },
      },
      transaction,
    );
  });
}
