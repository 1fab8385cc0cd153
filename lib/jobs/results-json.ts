/**
 * Turns an analysis into plain JSON for a JSONB column: typed arrays become arrays and
 * non-finite numbers become null (JSON has neither).
 */
export function toJsonSafe(value: unknown): unknown {
  if (value === null || value === undefined) return null;
  if (typeof value === "number") return Number.isFinite(value) ? value : null;
  if (typeof value !== "object") return value;
  if (ArrayBuffer.isView(value)) return Array.from(value as unknown as ArrayLike<number>, (v) => (Number.isFinite(v) ? v : null));
  if (Array.isArray(value)) return value.map(toJsonSafe);
  if (value instanceof Date) return value.toISOString();
  const out: Record<string, unknown> = {};
  for (const [key, inner] of Object.entries(value)) if (inner !== undefined && typeof inner !== "function") out[key] = toJsonSafe(inner);
  return out;
}
