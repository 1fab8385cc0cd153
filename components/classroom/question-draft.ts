/**
 * A quick question as the instructor types it, read into the request body with one message
 * per bad field (the API's names: "prompt", "choices", "choices.2"). Blank choice boxes at the
 * end are left out rather than refused, so an unused sixth box does not get in the way.
 */
import { QUESTION_CHOICES } from "./session-types";
import type { FieldErrors } from "./scenario-draft-read";

export const QUESTION_LIMITS = { prompt: 300, choice: 120 } as const;

/** A question a class is often asked about a capture; the instructor edits it freely. */
export const SUGGESTED_PROMPT = "What is wrong with this compass?";

export function readQuestion(
  prompt: string,
  choices: string[],
): { body: { prompt: string; choices: string[] } | null; errors: FieldErrors } {
  const errors: FieldErrors = {};
  const text = prompt.trim();
  if (!text) errors.prompt = "Write the question.";
  else if (text.length > QUESTION_LIMITS.prompt) errors.prompt = `Keep the question under ${QUESTION_LIMITS.prompt} characters.`;
  let last = choices.length;
  while (last > 0 && choices[last - 1].trim() === "") last -= 1;
  const kept = choices.slice(0, last).map((c) => c.trim());
  kept.forEach((choice, i) => {
    if (!choice) errors[`choices.${i}`] = "Fill this choice in, or remove it.";
    else if (choice.length > QUESTION_LIMITS.choice)
      errors[`choices.${i}`] = `Keep each choice under ${QUESTION_LIMITS.choice} characters.`;
  });
  const seen = new Map<string, number>();
  kept.forEach((choice, i) => {
    const key = choice.toLowerCase();
    if (!choice) return;
    if (seen.has(key)) errors[`choices.${i}`] ??= `The same as choice ${seen.get(key)! + 1}.`;
    else seen.set(key, i);
  });
  if (kept.length < QUESTION_CHOICES.min) errors.choices = `Give at least ${QUESTION_CHOICES.min} choices.`;
  else if (kept.length > QUESTION_CHOICES.max) errors.choices = `Give at most ${QUESTION_CHOICES.max} choices.`;
  if (Object.keys(errors).length) return { body: null, errors };
  return { body: { prompt: text, choices: kept }, errors };
}
