import { describe, expect, test } from "vitest";
import { JOIN_CODE_ALPHABET, JOIN_CODE_LENGTH, newJoinCode, normaliseJoinCode } from "@/lib/classroom/join-code";

describe("JOIN_CODE_ALPHABET", () => {
  // Look-alike pairs when read aloud or handwritten (common practice for short codes).
  test.each(["0", "O", "Q", "1", "I", "L", "2", "Z", "5", "S", "8", "B", "U", "V"])("leaves out %s", (character) => {
    expect(JOIN_CODE_ALPHABET).not.toContain(character);
  });

  test("has no repeated character", () => {
    expect(new Set(JOIN_CODE_ALPHABET).size).toBe(JOIN_CODE_ALPHABET.length);
  });
});

describe("newJoinCode", () => {
  test("six characters from the alphabet, and varied", () => {
    const codes = Array.from({ length: 200 }, newJoinCode);
    for (const code of codes) {
      expect(code).toHaveLength(JOIN_CODE_LENGTH);
      for (const character of code) expect(JOIN_CODE_ALPHABET).toContain(character);
    }
    // 21^6 ≈ 86 million codes: 200 draws repeat with probability about 2e-4.
    expect(new Set(codes).size).toBeGreaterThan(195);
  });
});

describe("normaliseJoinCode", () => {
  test.each([
    ["as shown", "K7MX3D", "K7MX3D"],
    ["lower case", "k7mx3d", "K7MX3D"],
    ["with a space", "K7M X3D", "K7MX3D"],
    ["with a dash", "k7m-x3d", "K7MX3D"],
    ["too short", "K7MX3", null],
    ["too long", "K7MX3DA", null],
    ["a look-alike left out of the alphabet", "K7MO3D", null],
    ["empty", "", null],
  ])("%s", (_label, typed, expected) => {
    expect(normaliseJoinCode(typed)).toBe(expected);
  });
});
