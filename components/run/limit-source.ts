/**
 * Where a check's limit comes from, in the words a technician reads. The threshold table
 * records a publication, "common practice" or "from memory" (a remembered figure not checked
 * against a source); the last two are said plainly and followed by the table's reasoning, a
 * publication is named as it stands.
 */
import { sentence, sentences } from "@/geometry/sentence";
import { THRESHOLDS, type Threshold } from "@/geometry/thresholds";
import type { Check } from "@/geometry/types";

export type LimitSourceKind = "typical" | "practice" | "workspace" | "publication";

export interface LimitSourceWords {
  kind: LimitSourceKind;
  /** The line to show, whole sentences. */
  text: string;
}

export const TYPICAL_VALUE_WORDS = "Typical value, no published source";
const PRACTICE = "common practice";
const MEMORY = "from memory";

/** The threshold's reasoning: carried by the check, or (results saved before it was) read from the table by the check's id. */
function reasoningOf(check: Pick<Check, "id" | "basis">): string | null {
  if (check.basis) return check.basis;
  return (THRESHOLDS as Record<string, Threshold | undefined>)[check.id]?.basis ?? null;
}

/** The words for a check's limit source; results JSON keeps the raw `source`. */
export function limitSourceWords(check: Pick<Check, "id" | "source" | "basis">): LimitSourceWords {
  const source = check.source.trim();
  if (source === MEMORY) return { kind: "typical", text: sentences(TYPICAL_VALUE_WORDS, reasoningOf(check)) };
  if (source.toLowerCase().startsWith(PRACTICE)) {
    return { kind: "practice", text: sentences(`Common practice${source.slice(PRACTICE.length)}`, reasoningOf(check)) };
  }
  if (source.startsWith("set by the workspace")) {
    // An override names the default it replaced and that default's source, in the same words.
    const text = source
      .replace(new RegExp(`, ${MEMORY}\\)$`), `; ${TYPICAL_VALUE_WORDS.toLowerCase()})`)
      .replace(new RegExp(`, ${PRACTICE}\\)$`), `; ${PRACTICE})`);
    return { kind: "workspace", text: sentence(text) };
  }
  return { kind: "publication", text: `Limit from: ${source}` };
}
