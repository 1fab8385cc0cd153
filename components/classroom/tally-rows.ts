/**
 * A question's answers arranged for the console: one row per choice with its count, its share
 * of the answers and who chose it, and the list of every participant's answer by name.
 */
import type { TallyQuestion } from "./session-types";

export interface TallyRow {
  index: number;
  choice: string;
  count: number;
  /** Share of all answers, 0–1 (0 when nobody has answered). */
  share: number;
  /** Participants who chose it, by name, alphabetical. */
  who: string[];
}

const byName = (a: string, b: string) => a.localeCompare(b, "en", { sensitivity: "base" });

export function tallyRows(question: TallyQuestion): TallyRow[] {
  const total = question.counts.reduce((sum, n) => sum + n, 0);
  return question.choices.map((choice, index) => {
    const count = question.counts[index] ?? 0;
    return {
      index,
      choice,
      count,
      share: total > 0 ? count / total : 0,
      who: question.answers
        .filter((a) => a.choice === index)
        .map((a) => a.participant)
        .sort(byName),
    };
  });
}

/** Each participant's answer as words, alphabetical by participant. */
export function answerList(question: TallyQuestion): { participant: string; choice: string }[] {
  return [...question.answers]
    .sort((a, b) => byName(a.participant, b.participant))
    .map((a) => ({ participant: a.participant, choice: question.choices[a.choice] ?? `choice ${a.choice + 1}` }));
}

/** "3 answers" / "1 answer" / "No answers yet". */
export function answerCountWords(question: TallyQuestion): string {
  const total = question.counts.reduce((sum, n) => sum + n, 0);
  if (total === 0) return "No answers yet";
  return `${total} answer${total === 1 ? "" : "s"}`;
}
