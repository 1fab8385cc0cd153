import { describe, expect, test } from "vitest";
import { hashPassword, verifyPassword } from "@/lib/password";
import { hashToken, newToken } from "@/lib/tokens";

describe("hashPassword / verifyPassword", () => {
  test("round trip, salted, and wrong passwords fail", async () => {
    const a = await hashPassword("tide-table-17");
    const b = await hashPassword("tide-table-17");
    expect(a).not.toBe(b);
    expect(await verifyPassword("tide-table-17", a)).toBe(true);
    expect(await verifyPassword("tide-table-18", a)).toBe(false);
  });

  test("Unicode is normalised (NFKC) before hashing", async () => {
    const stored = await hashPassword("ﬁeld-4"); // U+FB01 ligature
    expect(await verifyPassword("field-4", stored)).toBe(true);
  });

  test.each([
    ["empty", ""],
    ["other scheme", "bcrypt$x$y"],
    ["truncated", "scrypt$32768$8$1$"],
  ])("a malformed stored hash (%s) never verifies", async (_label, stored) => {
    expect(await verifyPassword("anything-1", stored)).toBe(false);
  });
});

describe("newToken / hashToken", () => {
  test("tokens are random, URL-safe and stored only as their SHA-256", () => {
    const { token, tokenHash } = newToken();
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(tokenHash).toBe(hashToken(token));
    expect(tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(newToken().token).not.toBe(token);
  });

  test("SHA-256 of 'abc' is the FIPS 180-2 example digest", () => {
    expect(hashToken("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });
});
