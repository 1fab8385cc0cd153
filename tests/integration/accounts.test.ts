import { afterAll, describe, expect, test } from "vitest";
import { signInAction } from "@/lib/actions/sign-in";
import { signUpAction } from "@/lib/actions/sign-up";
import { signOutAction } from "@/lib/actions/sign-out";
import { requestPasswordResetAction } from "@/lib/actions/request-password-reset";
import { resetPasswordAction } from "@/lib/actions/reset-password";
import { idle } from "@/lib/action-state";
import { closeDb, db } from "@/lib/db";
import { SIGN_IN_LIMITS } from "@/lib/data/users";
import { verifyPassword } from "@/lib/password";
import { actAs, fakeRequest } from "../support/request-context";
import { TEST_PASSWORD, form, makeUser, uniqueTag } from "../support/factories";
import { linkIn, waitForMail } from "../support/mailbox";

afterAll(() => closeDb());

/** Run an action that ends in redirect(); return where it redirected. */
async function redirectOf(run: () => Promise<unknown>): Promise<string> {
  try {
    const result = await run();
    throw new Error(`expected a redirect, got ${JSON.stringify(result)}`);
  } catch (error) {
    const digest = (error as { digest?: string }).digest ?? "";
    if (!digest.startsWith("NEXT_REDIRECT")) throw error;
    return digest.split(";")[2];
  }
}

describe("sign up", () => {
  test("creates the account with a salted scrypt hash and opens a session", async () => {
    actAs(null);
    const email = `new-${uniqueTag()}@tests.example`;
    const target = await redirectOf(() => signUpAction(idle, form({ name: "Nia Test", email, password: TEST_PASSWORD })));
    expect(target).toBe("/workspaces/new");
    const user = await db().models.User.findOne({ where: { email } });
    expect(user).not.toBeNull();
    expect(user!.passwordHash).toMatch(/^scrypt\$32768\$8\$1\$/);
    expect(user!.passwordHash).not.toContain(TEST_PASSWORD);
    expect(await verifyPassword(TEST_PASSWORD, user!.passwordHash)).toBe(true);
    expect(fakeRequest().userId).toBe(user!.id);
  });

  test("two accounts with the same password get different hashes (per-user salt)", async () => {
    const [a, b] = await Promise.all([makeUser("salt"), makeUser("salt")]);
    const rows = await db().models.User.findAll({ where: { id: [a.id, b.id] } });
    expect(rows[0].passwordHash).not.toBe(rows[1].passwordHash);
  });

  test.each([
    ["empty name", { name: "", email: "x@tests.example", password: TEST_PASSWORD }, "name"],
    ["bad e-mail", { name: "A", email: "not-an-address", password: TEST_PASSWORD }, "email"],
    ["short password", { name: "A", email: "x@tests.example", password: "short1" }, "password"],
    ["letters-only password", { name: "A", email: "x@tests.example", password: "onlyletterspassword" }, "password"],
  ])("rejects %s with a message on that field and writes nothing", async (_label, values, field) => {
    actAs(null);
    const before = await db().models.User.count();
    const state = await signUpAction(idle, form(values));
    expect(state.status).toBe("error");
    if (state.status === "error") expect(state.fieldErrors?.[field]).toBeTruthy();
    expect(await db().models.User.count()).toBe(before);
  });

  test("an e-mail already in use is refused on the e-mail field", async () => {
    const existing = await makeUser("dup");
    const state = await signUpAction(idle, form({ name: "Again", email: existing.email.toUpperCase(), password: TEST_PASSWORD }));
    expect(state).toMatchObject({ status: "error", fieldErrors: { email: expect.stringMatching(/already exists/) } });
  });
});

describe("sign in", () => {
  test("right password signs in and follows a same-site next path only", async () => {
    const user = await makeUser("signin");
    actAs(null, `198.51.100.${Math.floor(Math.random() * 200)}`);
    expect(await redirectOf(() => signInAction(idle, form({ email: user.email, password: TEST_PASSWORD, next: "/w/x" })))).toBe("/w/x");
    expect(fakeRequest().userId).toBe(user.id);
    actAs(null);
    expect(await redirectOf(() => signInAction(idle, form({ email: user.email, password: TEST_PASSWORD, next: "//evil.example" })))).toBe(
      "/workspaces",
    );
  });

  test("wrong password and unknown e-mail get the very same message", async () => {
    const user = await makeUser("same");
    actAs(null, "198.51.100.250");
    const wrongPassword = await signInAction(idle, form({ email: user.email, password: "not-the-password-9" }));
    const unknownEmail = await signInAction(idle, form({ email: `nobody-${uniqueTag()}@tests.example`, password: "whatever-9" }));
    expect(wrongPassword.status).toBe("error");
    expect(unknownEmail.status).toBe("error");
    if (wrongPassword.status === "error" && unknownEmail.status === "error") expect(wrongPassword.message).toBe(unknownEmail.message);
    expect(fakeRequest().userId).toBeUndefined();
  });

  test(`locks an account after ${SIGN_IN_LIMITS.perAccount} failures, even with the right password`, async () => {
    const user = await makeUser("limit");
    for (let i = 0; i < SIGN_IN_LIMITS.perAccount; i++) {
      actAs(null, `192.0.2.${i + 1}`); // different addresses: the per-account limit must still hold
      await signInAction(idle, form({ email: user.email, password: "wrong-password-1" }));
    }
    actAs(null, "192.0.2.99");
    const state = await signInAction(idle, form({ email: user.email, password: TEST_PASSWORD }));
    expect(state).toMatchObject({ status: "error", message: expect.stringMatching(/Too many sign-in attempts/) });
    expect(fakeRequest().userId).toBeUndefined();
  });

  test(`limits one address to ${SIGN_IN_LIMITS.perAddress} failures across accounts`, async () => {
    const ip = `203.0.113.${100 + Math.floor(Math.random() * 100)}`;
    actAs(null, ip);
    for (let i = 0; i < SIGN_IN_LIMITS.perAddress; i++) {
      await signInAction(idle, form({ email: `spray-${i}-${uniqueTag()}@tests.example`, password: "wrong-password-1" }));
    }
    const user = await makeUser("victim");
    const state = await signInAction(idle, form({ email: user.email, password: TEST_PASSWORD }));
    expect(state).toMatchObject({ status: "error", message: expect.stringMatching(/Too many/) });
  });

  test("sign out ends the session", async () => {
    const user = await makeUser("out");
    actAs(user.id);
    expect(await redirectOf(() => signOutAction())).toMatch(/^\/sign-in/);
    expect(fakeRequest().userId).toBeUndefined();
  });
});

describe("password reset by e-mail", () => {
  test("the mailed link sets a new password once, then stops working", async () => {
    const user = await makeUser("reset");
    actAs(null);
    const asked = await requestPasswordResetAction(idle, form({ email: user.email }));
    expect(asked.status).toBe("ok");
    const mail = await waitForMail(user.email, /Reset your Loxodrome password/);
    const token = linkIn(mail, "/reset-password/").split("/").pop()!;

    const mismatch = await resetPasswordAction(idle, form({ token, password: "brand-new-pass-7", confirm: "other-pass-7" }));
    expect(mismatch).toMatchObject({ status: "error", fieldErrors: { confirm: expect.any(String) } });

    expect(
      await redirectOf(() => resetPasswordAction(idle, form({ token, password: "brand-new-pass-7", confirm: "brand-new-pass-7" }))),
    ).toBe("/sign-in?reset=1");
    const row = await db().models.User.findByPk(user.id);
    expect(await verifyPassword("brand-new-pass-7", row!.passwordHash)).toBe(true);

    const again = await resetPasswordAction(idle, form({ token, password: "third-pass-77", confirm: "third-pass-77" }));
    expect(again).toMatchObject({ status: "error", message: expect.stringMatching(/expired or was already used/) });
  });

  test("an unknown address gets the same answer and no mail", async () => {
    actAs(null);
    const email = `ghost-${uniqueTag()}@tests.example`;
    const state = await requestPasswordResetAction(idle, form({ email }));
    expect(state.status).toBe("ok");
    await expect(waitForMail(email, /Reset/, 800)).rejects.toThrow(/no mail/);
  });
});
