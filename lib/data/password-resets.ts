import "server-only";
import { Op } from "sequelize";
import { recordAudit } from "@/lib/audit";
import { db } from "@/lib/db";
import { sendPasswordResetMail } from "@/lib/mail";
import { hashPassword } from "@/lib/password";
import { hashToken, newToken } from "@/lib/tokens";

export const RESET_MINUTES = 60;

export class ResetError extends Error {}

/**
 * Send a reset link when the address has an account. The caller answers the same either way,
 * so the form cannot be used to learn who has an account.
 */
export async function requestPasswordReset(email: string): Promise<void> {
  const { models } = db();
  const user = await models.User.findOne({ where: { email: email.toLowerCase() } });
  if (!user) return;
  // At most three open links per account per hour, so the form cannot be used to flood an inbox.
  const recent = await models.PasswordResetToken.count({
    where: { userId: user.id, createdAt: { [Op.gt]: new Date(Date.now() - RESET_MINUTES * 60_000) } },
  });
  if (recent >= 3) return;
  const { token, tokenHash } = newToken();
  const expiresAt = new Date(Date.now() + RESET_MINUTES * 60_000);
  await models.PasswordResetToken.create({ userId: user.id, tokenHash, expiresAt });
  await recordAudit({ actorId: user.id, action: "password.reset-requested" });
  await sendPasswordResetMail({ to: user.email, name: user.name, token, expiresAt });
}

export async function isResetTokenUsable(token: string): Promise<boolean> {
  const row = await db().models.PasswordResetToken.findOne({ where: { tokenHash: hashToken(token) } });
  return Boolean(row && !row.usedAt && row.expiresAt.getTime() > Date.now());
}

/** Set a new password with a reset token; the token and every other open one stop working. */
export async function resetPassword(token: string, password: string): Promise<{ userId: string }> {
  const { sequelize, models } = db();
  const passwordHash = await hashPassword(password);
  return sequelize.transaction(async (transaction) => {
    const row = await models.PasswordResetToken.findOne({ where: { tokenHash: hashToken(token) }, transaction, lock: true });
    if (!row || row.usedAt || row.expiresAt.getTime() <= Date.now()) {
      throw new ResetError("This reset link has expired or was already used. Ask for a new one.");
    }
    await models.User.update({ passwordHash }, { where: { id: row.userId }, transaction });
    await models.PasswordResetToken.update({ usedAt: new Date() }, { where: { userId: row.userId, usedAt: null }, transaction });
    await models.SignInAttempt.destroy({
      where: { succeeded: false, email: (await models.User.findByPk(row.userId, { transaction, rejectOnEmpty: true })).email },
      transaction,
    });
    await recordAudit({ actorId: row.userId, action: "password.reset" }, transaction);
    return { userId: row.userId };
  });
}
