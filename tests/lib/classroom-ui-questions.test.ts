import { describe, expect, test } from "vitest";
import { readQuestion } from "@/components/classroom/question-draft";
import { answerCountWords, answerList, tallyRows } from "@/components/classroom/tally-rows";
import type { TallyQuestion } from "@/components/classroom/session-types";

describe("readQuestion", () => {
  test("trims, and leaves out blank boxes at the end", () => {
    expect(readQuestion("  What is wrong? ", [" Offset ", "Rotation", "", " "])).toEqual({
      body: { prompt: "What is wrong?", choices: ["Offset", "Rotation"] },
      errors: {},
    });
  });

  test.each([
    ["no prompt", "", ["a", "b"], "prompt"],
    ["a single choice", "Q?", ["only", ""], "choices"],
    ["seven choices", "Q?", ["1", "2", "3", "4", "5", "6", "7"], "choices"],
    ["a blank choice in the middle", "Q?", ["a", " ", "c"], "choices.1"],
    ["the same choice twice", "Q?", ["Soft iron", "soft iron"], "choices.1"],
    ["an overlong choice", "Q?", ["a", "x".repeat(121)], "choices.1"],
  ])("%s", (_label, prompt, choices, key) => {
    const { body, errors } = readQuestion(prompt, choices);
    expect(body).toBeNull();
    expect(Object.keys(errors)).toEqual([key]);
  });
});

// An invented class.
const question: TallyQuestion = {
  id: "q1",
  prompt: "What is wrong with this compass?",
  choices: ["Nothing", "Not turned over", "Mounted against its declaration"],
  open: true,
  counts: [1, 2, 0],
  answers: [
    { participant: "ruth", choice: 1 },
    { participant: "Ade", choice: 0 },
    { participant: "Bea", choice: 1 },
  ],
};

describe("tallyRows", () => {
  test("one row per choice with its count, share and who chose it", () => {
    expect(tallyRows(question)).toEqual([
      { index: 0, choice: "Nothing", count: 1, share: 1 / 3, who: ["Ade"] },
      { index: 1, choice: "Not turned over", count: 2, share: 2 / 3, who: ["Bea", "ruth"] },
      { index: 2, choice: "Mounted against its declaration", count: 0, share: 0, who: [] },
    ]);
  });

  test("no answers: every share is 0", () => {
    expect(tallyRows({ ...question, counts: [0, 0, 0], answers: [] }).map((r) => r.share)).toEqual([0, 0, 0]);
  });
});

describe("answerList and answerCountWords", () => {
  test("each participant's answer in words, alphabetical whatever the case", () => {
    expect(answerList(question)).toEqual([
      { participant: "Ade", choice: "Nothing" },
      { participant: "Bea", choice: "Not turned over" },
      { participant: "ruth", choice: "Not turned over" },
    ]);
  });

  test.each([
    [[0, 0, 0], "No answers yet"],
    [[0, 1, 0], "1 answer"],
    [[1, 2, 0], "3 answers"],
  ])("%j → %s", (counts, words) => {
    expect(answerCountWords({ ...question, counts })).toBe(words);
  });
});
