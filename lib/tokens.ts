import crypto from "node:crypto";

/** A random URL-safe token for e-mailed links, and the SHA-256 hex digest kept in the database. */
export function newToken(): { token: string; tokenHash: string } {
  const token = crypto.randomBytes(32).toString("base64url");
  return { token, tokenHash: hashToken(token) };
}

export function hashToken(token: string): string {
  return crypto.createHash("sha256").update(token).digest("hex");
}
