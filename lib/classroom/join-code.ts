import "server-only";
import crypto from "node:crypto";

/**
 * Join codes: six characters a class reads off a projector and types on a phone. The
 * alphabet leaves out characters that are easily confused when read aloud or in handwriting
 * (0/O/Q, 1/I/L, 2/Z, 5/S, 8/B, U/V): 21 characters, about 86 million codes.
 */
export const JOIN_CODE_ALPHABET = "ACDEFGHJKMNPRTWXY3467";
export const JOIN_CODE_LENGTH = 6;

/** A fresh random code (crypto-grade, so codes cannot be predicted from earlier ones). */
export function newJoinCode(): string {
  let code = "";
  for (let i = 0; i < JOIN_CODE_LENGTH; i++) code += JOIN_CODE_ALPHABET[crypto.randomInt(JOIN_CODE_ALPHABET.length)];
  return code;
}

/**
 * A code as typed — any case, with spaces or dashes — in its stored form, or null when it
 * cannot be a code at all (wrong length or a character outside the alphabet).
 */
export function normaliseJoinCode(typed: string): string | null {
  const code = typed.toUpperCase().replace(/[\s-]+/g, "");
  if (code.length !== JOIN_CODE_LENGTH) return null;
  for (const character of code) if (!JOIN_CODE_ALPHABET.includes(character)) return null;
  return code;
}
