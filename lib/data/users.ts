import "server-only";
import { Op, UniqueConstraintError } from "sequelize";
import { recordAudit } from "@/lib/audit";
import { db } from "@/lib/db";
import { decoyPasswordHash, hashPassword, verifyPassword } from "@/lib/password";
import type { User } from "@/models";

export interface UserSummary {
  id: string;
  name: string;
  email: string;
  createdAt: string;
}

function toSummary(user: User): UserSummary {
  return { id: user.id, name: user.name, email: user.email, createdAt: user.createdAt.toISOString() };
}

export class EmailTakenError extends Error {
  constructor() {
    super("An account with this e-mail address already exists.");
  }
}

export async function createUser(input: { name: string; email: string; password: string }): Promise<UserSummary> {
  try {
    const user = await db().models.User.create({
      name: input.name,
      email: input.email.toLowerCase(),
      passwordHash: await hashPassword(input.password),
    });
    await recordAudit({ actorId: user.id, action: "account.created", targetType: "user", targetId: user.id });
    return toSummary(user);
  } catch (error) {
    if (error instanceof UniqueConstraintError) throw new EmailTakenError();
    throw error;
  }
}

export async function getUserById(id: string): Promise<UserSummary | null> {
  const user = await db().models.User.findByPk(id);
  return user ? toSummary(user) : null;
}

export async function getUserByEmail(email: string): Promise<UserSummary | null> {
  const user = await db().models.User.findOne({ where: { email: email.toLowerCase() } });
  return user ? toSummary(user) : null;
}

/** Limits on failed sign-ins within the window (common practice for web sign-in forms). */
export const SIGN_IN_LIMITS = { windowMinutes: 15, perAccount: 5, perAddress: 20 };

export type SignInResult =
  { ok: true; user: UserSummary } | { ok: false; reason: "invalid" } | { ok: false; reason: "rate-limited"; retryAfterMinutes: number };

/**
 * Check e-mail and password, with a limit on recent failures per account and per address.
 * Unknown e-mail and wrong password take the same time and give the same answer.
 */
export async function authenticate(email: string, password: string, ipAddress: string): Promise<SignInResult> {
  const { SignInAttempt, User } = db().models;
  const normalized = email.toLowerCase();
  const since = new Date(Date.now() - SIGN_IN_LIMITS.windowMinutes * 60_000);
  const [accountFailures, addressFailures] = await Promise.all([
    SignInAttempt.count({ where: { email: normalized, succeeded: false, createdAt: { [Op.gte]: since } } }),
    SignInAttempt.count({ where: { ipAddress, succeeded: false, createdAt: { [Op.gte]: since } } }),
  ]);
  if (accountFailures >= SIGN_IN_LIMITS.perAccount || addressFailures >= SIGN_IN_LIMITS.perAddress) {
    return { ok: false, reason: "rate-limited", retryAfterMinutes: SIGN_IN_LIMITS.windowMinutes };
  }
  const user = await User.findOne({ where: { email: normalized } });
  const valid = await verifyPassword(password, user?.passwordHash ?? (await decoyPasswordHash()));
  const succeeded = Boolean(user) && valid;
  await SignInAttempt.create({ email: normalized, ipAddress, succeeded });
  if (!succeeded || !user) return { ok: false, reason: "invalid" };
  // A success clears the account's failures so a forgetful owner is not locked out later.
  await SignInAttempt.destroy({ where: { email: normalized, succeeded: false } });
  await recordAudit({ actorId: user.id, action: "session.signed-in", ipAddress });
  return { ok: true, user: toSummary(user) };
}
