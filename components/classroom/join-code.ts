/**
 * A join code as people type it — lower case, with spaces or a dash in the middle, read off a
 * projector — brought to the form the server issues: six upper-case letters and figures.
 */
export const JOIN_CODE_LENGTH = 6;

export function normaliseJoinCode(typed: string): string {
  return typed.toUpperCase().replace(/[^A-Z0-9]/g, "");
}

/** A message for a code that cannot be right, before asking the server; null when it may be. */
export function joinCodeProblem(code: string): string | null {
  if (code.length === 0) return "Type the code your instructor shows.";
  if (code.length !== JOIN_CODE_LENGTH) return `The code has ${JOIN_CODE_LENGTH} letters and figures; this one has ${code.length}.`;
  return null;
}

export const DISPLAY_NAME_MAX = 40;

/** A guest's display name, trimmed, or a message saying what it lacks. */
export function readDisplayName(typed: string): { name: string | null; problem: string | null } {
  const name = typed.trim().replace(/\s+/g, " ");
  if (!name) return { name: null, problem: "Give a name for the instructor to see beside your answers." };
  if (name.length > DISPLAY_NAME_MAX) return { name: null, problem: `Keep the name under ${DISPLAY_NAME_MAX} characters.` };
  return { name, problem: null };
}
