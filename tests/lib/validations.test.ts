import { describe, expect, test } from "vitest";
import { signUpSchema, resetPasswordSchema } from "@/lib/validations/auth";
import { createWorkspaceSchema, inviteMemberSchema } from "@/lib/validations/workspace";

function firstErrorPath(result: { success: boolean; error?: { issues: { path: PropertyKey[] }[] } }): string | undefined {
  return result.success ? undefined : result.error!.issues[0].path.join(".");
}

describe("signUpSchema", () => {
  test("normalises e-mail case and whitespace", () => {
    const parsed = signUpSchema.parse({ name: " Ada ", email: "  Ada@Tests.Example ", password: "long-enough-1" });
    expect(parsed).toMatchObject({ name: "Ada", email: "ada@tests.example" });
  });
  test.each([
    ["name", { name: "", email: "a@tests.example", password: "long-enough-1" }],
    ["email", { name: "A", email: "a@", password: "long-enough-1" }],
    ["password", { name: "A", email: "a@tests.example", password: "abcdefghijk" }],
  ])("names the %s field when it is wrong", (field, input) => {
    expect(firstErrorPath(signUpSchema.safeParse(input))).toBe(field);
  });
});

describe("resetPasswordSchema", () => {
  test("a mismatched confirmation is reported on the confirm field", () => {
    expect(
      firstErrorPath(resetPasswordSchema.safeParse({ token: "t".repeat(20), password: "long-enough-1", confirm: "long-enough-2" })),
    ).toBe("confirm");
  });
});

describe("createWorkspaceSchema", () => {
  test.each([
    ["upper case is folded", "North-Ridge", true],
    ["dash at the end", "north-", false],
    ["too short", "ab", false],
    ["spaces", "north ridge", false],
  ])("slug: %s", (_label, slug, ok) => {
    expect(createWorkspaceSchema.safeParse({ name: "North Ridge", slug, kind: "operator" }).success).toBe(ok);
  });
});

describe("inviteMemberSchema", () => {
  test("refuses a role that does not exist", () => {
    expect(firstErrorPath(inviteMemberSchema.safeParse({ email: "a@tests.example", role: "admiral" }))).toBe("role");
  });
});
