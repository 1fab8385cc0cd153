import "server-only";
import { Op } from "sequelize";
import { recordAudit } from "@/lib/audit";
import { db } from "@/lib/db";
import { sendInvitationMail } from "@/lib/mail";
import { ROLE_LABELS, type Role } from "@/lib/roles";
import { hashToken, newToken } from "@/lib/tokens";
import type { Invitation, Workspace } from "@/models";

export const INVITATION_DAYS = 7;

export interface InvitationSummary {
  id: string;
  email: string;
  role: Role;
  expiresAt: string;
  createdAt: string;
}

/** What the person holding an invitation link may see before accepting it. */
export interface InvitationPreview {
  email: string;
  role: Role;
  workspaceName: string;
  workspaceSlug: string;
  status: "open" | "expired" | "accepted" | "revoked";
}

export class InvitationError extends Error {}

function toSummary(i: Invitation): InvitationSummary {
  return { id: i.id, email: i.email, role: i.role, expiresAt: i.expiresAt.toISOString(), createdAt: i.createdAt.toISOString() };
}

/** Invite someone by e-mail; the link in the message carries a token stored only as a hash. */
export async function inviteMember(input: {
  workspaceId: string;
  inviterId: string;
  email: string;
  role: Role;
}): Promise<InvitationSummary> {
  const { sequelize, models } = db();
  const existingUser = await models.User.findOne({ where: { email: input.email } });
  if (existingUser && (await models.Membership.findOne({ where: { workspaceId: input.workspaceId, userId: existingUser.id } }))) {
    throw new InvitationError("This person is already a member of the workspace.");
  }
  const { token, tokenHash } = newToken();
  const expiresAt = new Date(Date.now() + INVITATION_DAYS * 86_400_000);
  const workspace = await models.Workspace.findByPk(input.workspaceId, { rejectOnEmpty: true });
  const inviter = await models.User.findByPk(input.inviterId, { rejectOnEmpty: true });
  const invitation = await sequelize.transaction(async (transaction) => {
    // A new invitation replaces any open one for the same address.
    await models.Invitation.update(
      { revokedAt: new Date() },
      { where: { workspaceId: input.workspaceId, email: input.email, acceptedAt: null, revokedAt: null }, transaction },
    );
    const created = await models.Invitation.create(
      { workspaceId: input.workspaceId, email: input.email, role: input.role, tokenHash, invitedById: input.inviterId, expiresAt },
      { transaction },
    );
    await recordAudit(
      {
        workspaceId: input.workspaceId,
        actorId: input.inviterId,
        action: "member.invited",
        targetType: "invitation",
        targetId: created.id,
        detail: { email: input.email, role: input.role },
      },
      transaction,
    );
    return created;
  });
  await sendInvitationMail({
    to: input.email,
    inviterName: inviter.name,
    workspaceName: workspace.name,
    roleLabel: ROLE_LABELS[input.role],
    token,
    expiresAt,
  });
  return toSummary(invitation);
}

export async function listOpenInvitations(workspaceId: string): Promise<InvitationSummary[]> {
  const rows = await db().models.Invitation.findAll({
    where: { workspaceId, acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: new Date() } },
    order: [["createdAt", "DESC"]],
  });
  return rows.map(toSummary);
}

export async function revokeInvitation(workspaceId: string, actorId: string, invitationId: string): Promise<void> {
  const invitation = await db().models.Invitation.findOne({ where: { id: invitationId, workspaceId, acceptedAt: null, revokedAt: null } });
  if (!invitation) throw new InvitationError("That invitation is no longer open.");
  await invitation.update({ revokedAt: new Date() });
  await recordAudit({
    workspaceId,
    actorId,
    action: "invitation.revoked",
    targetType: "invitation",
    targetId: invitation.id,
    detail: { email: invitation.email },
  });
}

async function findByToken(token: string) {
  return db().models.Invitation.findOne({
    where: { tokenHash: hashToken(token) },
    include: [{ model: db().models.Workspace, as: "workspace", required: true }],
  });
}

function statusOf(i: Invitation): InvitationPreview["status"] {
  if (i.revokedAt) return "revoked";
  if (i.acceptedAt) return "accepted";
  if (i.expiresAt.getTime() <= Date.now()) return "expired";
  return "open";
}

export async function previewInvitation(token: string): Promise<InvitationPreview | null> {
  const invitation = await findByToken(token);
  if (!invitation) return null;
  const workspace = (invitation as unknown as { workspace: Workspace }).workspace;
  return {
    email: invitation.email,
    role: invitation.role,
    workspaceName: workspace.name,
    workspaceSlug: workspace.slug,
    status: statusOf(invitation),
  };
}

/** Accept an open invitation as the signed-in user, whose e-mail must be the one invited. */
export async function acceptInvitation(token: string, user: { id: string; email: string }): Promise<{ workspaceSlug: string }> {
  const { sequelize, models } = db();
  return sequelize.transaction(async (transaction) => {
    const invitation = await models.Invitation.findOne({ where: { tokenHash: hashToken(token) }, transaction, lock: true });
    if (!invitation) throw new InvitationError("This invitation link is not valid.");
    const status = statusOf(invitation);
    if (status !== "open") throw new InvitationError(`This invitation is ${status}. Ask the workspace owner for a new one.`);
    if (invitation.email !== user.email.toLowerCase()) {
      throw new InvitationError(`This invitation is for ${invitation.email}. Sign in with that address to accept it.`);
    }
    const workspace = await models.Workspace.findByPk(invitation.workspaceId, { transaction, rejectOnEmpty: true });
    const existing = await models.Membership.findOne({ where: { workspaceId: workspace.id, userId: user.id }, transaction });
    if (!existing) await models.Membership.create({ workspaceId: workspace.id, userId: user.id, role: invitation.role }, { transaction });
    await invitation.update({ acceptedAt: new Date(), acceptedById: user.id }, { transaction });
    await recordAudit(
      {
        workspaceId: workspace.id,
        actorId: user.id,
        action: "member.joined",
        targetType: "user",
        targetId: user.id,
        detail: { role: invitation.role },
      },
      transaction,
    );
    return { workspaceSlug: workspace.slug };
  });
}
