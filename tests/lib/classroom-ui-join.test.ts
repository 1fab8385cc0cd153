import { describe, expect, test } from "vitest";
import { joinCodeProblem, normaliseJoinCode, readDisplayName } from "@/components/classroom/join-code";

describe("normaliseJoinCode", () => {
  test.each([
    ["as issued", "K7QX4M", "K7QX4M"],
    ["lower case", "k7qx4m", "K7QX4M"],
    ["spaced as read aloud", "k7q x4m", "K7QX4M"],
    ["with a dash", "K7Q-X4M", "K7QX4M"],
    ["pasted with a newline", " K7QX4M\n", "K7QX4M"],
  ])("%s: %j → %s", (_label, typed, code) => {
    expect(normaliseJoinCode(typed)).toBe(code);
  });
});

describe("joinCodeProblem", () => {
  test.each([
    ["", /Type the code/],
    ["K7QX4", /has 5/],
    ["K7QX4M", null],
  ])("%j", (code, message) => {
    const problem = joinCodeProblem(code);
    if (message === null) expect(problem).toBeNull();
    else expect(problem).toMatch(message);
  });
});

describe("readDisplayName", () => {
  test.each([
    ["a name", "  Noor  ", "Noor", null],
    ["inner spaces squeezed", "Noor   Haddad", "Noor Haddad", null],
    ["blank", "   ", null, /Give a name/],
    ["too long", "x".repeat(41), null, /under 40/],
  ])("%s", (_label, typed, name, problem) => {
    const read = readDisplayName(typed);
    expect(read.name).toBe(name);
    if (problem) expect(read.problem).toMatch(problem);
    else expect(read.problem).toBeNull();
  });
});
