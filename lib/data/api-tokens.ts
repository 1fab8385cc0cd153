import "server-only";
import crypto from "node:crypto";
import { recordAudit } from "@/lib/audit";
import { db } from "@/lib/db";
import { getUserById, type UserSummary } from "@/lib/data/users";
import { hashToken } from "@/lib/tokens";

export interface ApiTokenSummary {
  id: string;
  name: string;
  prefix: string;
  lastUsedAt: string | null;
  createdAt: string;
}

const TOKEN_PREFIX = "lox_";

/** Create a personal API token. The secret is returned once and stored only as a hash. */
export async function createApiToken(userId: string, name: string): Promise<{ token: string; summary: ApiTokenSummary }> {
  const secret = crypto.randomBytes(32).toString("base64url");
  const token = `${TOKEN_PREFIX}${secret}`;
  const row = await db().models.ApiToken.create({ userId, name, prefix: token.slice(0, 12), tokenHash: hashToken(token) });
  await recordAudit({ actorId: userId, action: "api-token.created", targetType: "api-token", targetId: row.id, detail: { name } });
  return { token, summary: { id: row.id, name: row.name, prefix: row.prefix, lastUsedAt: null, createdAt: row.createdAt.toISOString() } };
}

export async function listApiTokens(userId: string): Promise<ApiTokenSummary[]> {
  const rows = await db().models.ApiToken.findAll({ where: { userId, revokedAt: null }, order: [["createdAt", "DESC"]] });
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    prefix: r.prefix,
    lastUsedAt: r.lastUsedAt?.toISOString() ?? null,
    createdAt: r.createdAt.toISOString(),
  }));
}

export async function revokeApiToken(userId: string, id: string): Promise<boolean> {
  const [count] = await db().models.ApiToken.update({ revokedAt: new Date() }, { where: { id, userId, revokedAt: null } });
  if (count) await recordAudit({ actorId: userId, action: "api-token.revoked", targetType: "api-token", targetId: id });
  return count > 0;
}

/** The user a bearer token belongs to, or null for an unknown or revoked token. */
export async function userForApiToken(token: string): Promise<UserSummary | null> {
  if (!token.startsWith(TOKEN_PREFIX)) return null;
  const row = await db().models.ApiToken.findOne({ where: { tokenHash: hashToken(token), revokedAt: null } });
  if (!row) return null;
  // Recording every use would write on every request; once a minute is enough to show activity.
  if (!row.lastUsedAt || Date.now() - row.lastUsedAt.getTime() > 60_000) await row.update({ lastUsedAt: new Date() });
  return getUserById(row.userId);
}
