/**
 * Record ids: every table keys its rows by a UUID. One test of the shape, for route params,
 * search params and client-side filters alike (pure, so client components use it too);
 * inputs parsed with zod use `uuidSchema` from lib/validations/fleet.ts.
 */
const UUID_PATTERN = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** True when `text` has the shape of a record id (a UUID, any version, either case). */
export function isRecordId(text: unknown): text is string {
  return typeof text === "string" && UUID_PATTERN.test(text);
}
