import { describe, expect, test } from "vitest";
import { sentence, sentences, withoutFinalStop } from "@/geometry/sentence";

describe("sentence", () => {
  test.each([
    { label: "no full stop", text: "roll about 30° to the right", out: "Roll about 30° to the right." },
    { label: "one full stop", text: "Roll about 30° to the right.", out: "Roll about 30° to the right." },
    { label: "two full stops", text: "Roll about 30° to the right..", out: "Roll about 30° to the right." },
    { label: "a stop and trailing spaces", text: "  roll right. . ", out: "Roll right." },
    { label: "a stop inside is kept", text: "aim the nose. Then roll right", out: "Aim the nose. Then roll right." },
    { label: "empty", text: "", out: "" },
    { label: "only stops", text: " .. ", out: "" },
  ])("$label", ({ text, out }) => {
    expect(sentence(text)).toBe(out);
  });
});

describe("withoutFinalStop", () => {
  test.each([
    { label: "a sentence", text: "Log for longer.", out: "Log for longer" },
    { label: "no stop", text: "log for longer", out: "log for longer" },
    { label: "an ellipsis character is not a full stop", text: "wait…", out: "wait…" },
  ])("$label", ({ text, out }) => {
    expect(withoutFinalStop(text)).toBe(out);
  });
});

describe("sentences", () => {
  test.each([
    { label: "pieces with and without stops", pieces: ["Repeat the capture.", "aim the nose"], out: "Repeat the capture. Aim the nose." },
    {
      label: "a piece that is two sentences",
      pieces: ["Repeat", "Aim the nose. Then roll right."],
      out: "Repeat. Aim the nose. Then roll right.",
    },
    { label: "missing pieces left out", pieces: ["Repeat", null, "", undefined, "aim."], out: "Repeat. Aim." },
  ])("$label", ({ pieces, out }) => {
    expect(sentences(...pieces)).toBe(out);
  });
});
