/**
 * Sentences for the words a technician reads. Advice is often built from pieces that are
 * sentences already ("…roll about 30° to the right."); putting them together by hand is how a
 * full stop gets doubled. These helpers end every sentence with exactly one full stop, however
 * many its pieces brought.
 */

/** The text without its trailing full stops and spaces, to go inside a longer sentence. */
export function withoutFinalStop(text: string): string {
  return text.replace(/[\s.]+$/u, "").trim();
}

/** The text as one sentence: trimmed, a capital first letter and exactly one final full stop; empty text stays empty. */
export function sentence(text: string): string {
  const body = withoutFinalStop(text);
  if (body === "") return "";
  return `${body.charAt(0).toUpperCase()}${body.slice(1)}.`;
}

/** The pieces as consecutive sentences, each ended by one full stop; empty or missing pieces are left out. */
export function sentences(...pieces: (string | null | undefined)[]): string {
  return pieces
    .map((piece) => sentence(piece ?? ""))
    .filter((piece) => piece !== "")
    .join(" ");
}
