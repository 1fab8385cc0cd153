/**
 * The first visit, end to end in headless Chromium against the real server and PostgreSQL:
 * sign up → create a workspace → invite a technician → open the invitation from the captured
 * mail → accept it by creating an account → the pages and buttons match the technician's role.
 */
import { afterAll, beforeAll, expect, inject, test } from "vitest";
import type { Browser, Page } from "playwright-core";
import { artefactPath, launchBrowser } from "../support/browser";
import { uniqueTag } from "../support/factories";

let browser: Browser;
const baseUrl = inject("baseUrl");
const tag = uniqueTag();
const owner = { name: "Wren Okafor", email: `wren-${tag}@tests.example`, password: "first-light-2026" };
const tech = { name: "Idris Palm", email: `idris-${tag}@tests.example`, password: "bench-work-2026" };
const slug = `harbour-${tag}`;

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

async function fill(page: Page, label: string, value: string) {
  await page.getByLabel(label, { exact: true }).fill(value);
}

test("sign up, create a workspace, invite a technician who accepts and sees what a technician may do", async () => {
  const ownerContext = await browser.newContext();
  const page = await ownerContext.newPage();

  // Sign up: a bad password is refused next to the field, then a good one goes through.
  await page.goto(`${baseUrl}/sign-up`);
  await fill(page, "Your name", owner.name);
  await fill(page, "E-mail", owner.email);
  await fill(page, "Password", "short");
  await page.getByRole("button", { name: "Create account" }).click();
  await expect.poll(() => page.locator("#field-password-error").textContent(), { timeout: 15_000 }).toMatch(/at least 10 characters/);
  await fill(page, "Password", owner.password);
  await page.getByRole("button", { name: "Create account" }).click();
  await page.waitForURL(`${baseUrl}/workspaces/new`);

  // Create the workspace.
  await fill(page, "Name", "Harbour Light Repairs");
  await fill(page, "Address", slug);
  await page.getByLabel("Kind").selectOption("repair-shop");
  await page.getByRole("button", { name: "Create workspace" }).click();
  await page.waitForURL(`${baseUrl}/w/${slug}`);
  await expect.poll(() => page.getByTestId("my-role").textContent(), { timeout: 15_000 }).toContain("Owner");
  for (const tab of ["Overview", "People", "Logbook", "Settings"]) {
    expect(await page.getByRole("navigation", { name: "Workspace" }).getByRole("link", { name: tab }).count()).toBe(1);
  }

  // Invite a technician.
  await page.getByRole("link", { name: "People" }).click();
  await page.waitForURL(`${baseUrl}/w/${slug}/members`);
  const invite = page.getByRole("form", { name: "Invite someone" });
  await invite.getByLabel("E-mail").fill(tech.email);
  await invite.getByLabel("Role").selectOption("technician");
  await invite.getByRole("button", { name: "Send invitation" }).click();
  await expect
    .poll(() => page.getByRole("status").first().textContent(), { timeout: 15_000 })
    .toContain(`Invitation sent to ${tech.email}`);
  await page.screenshot({ path: artefactPath("members-owner.png"), fullPage: true });

  // The technician opens the captured mail and follows the link.
  const techContext = await browser.newContext();
  const techPage = await techContext.newPage();
  await techPage.goto(`${baseUrl}/dev/mail`);
  const mail = techPage.getByTestId("captured-mail").filter({ hasText: tech.email }).first();
  await expect.poll(() => mail.textContent(), { timeout: 15_000 }).toContain("Join Harbour Light Repairs");
  await mail.getByRole("link", { name: /\/invitations\// }).click();
  await techPage.waitForURL(/\/invitations\//);
  expect(await techPage.getByRole("heading", { level: 1 }).textContent()).toContain("Join Harbour Light Repairs");

  // Accept by creating the account; the e-mail is fixed to the invited address.
  expect(await techPage.getByLabel("E-mail").inputValue()).toBe(tech.email);
  await fill(techPage, "Your name", tech.name);
  await fill(techPage, "Password", tech.password);
  await techPage.getByRole("button", { name: "Create account" }).click();
  await techPage.waitForURL(`${baseUrl}/w/${slug}`);

  // Sign out and back in through the sign-in page, as a returning technician would.
  await techPage.getByRole("button", { name: "Sign out" }).click();
  await techPage.waitForURL(/\/sign-in/);
  await fill(techPage, "E-mail", tech.email);
  await fill(techPage, "Password", "not-my-password-1");
  await techPage.getByRole("button", { name: "Sign in" }).click();
  await expect.poll(() => techPage.getByRole("alert").first().textContent(), { timeout: 15_000 }).toContain("do not match");
  await fill(techPage, "Password", tech.password);
  await techPage.getByRole("button", { name: "Sign in" }).click();
  await techPage.waitForURL(`${baseUrl}/workspaces`);
  await techPage
    .getByRole("link", { name: /Harbour Light Repairs/ })
    .first()
    .click();
  await techPage.waitForURL(`${baseUrl}/w/${slug}`);

  // What a technician sees: people and the logbook, but no settings and no invitation form.
  await expect.poll(() => techPage.getByTestId("my-role").textContent(), { timeout: 15_000 }).toContain("Technician");
  const nav = techPage.getByRole("navigation", { name: "Workspace" });
  expect(await nav.getByRole("link", { name: "People" }).count()).toBe(1);
  expect(await nav.getByRole("link", { name: "Logbook" }).count()).toBe(1);
  expect(await nav.getByRole("link", { name: "Settings" }).count()).toBe(0);
  await techPage.goto(`${baseUrl}/w/${slug}/members`);
  expect(await techPage.getByTestId("member-row").count()).toBe(2);
  expect(await techPage.getByRole("form", { name: "Invite someone" }).count()).toBe(0);
  expect(await techPage.getByRole("button", { name: "Remove" }).count()).toBe(0);
  expect(await techPage.getByRole("combobox", { name: /Role of/ }).count()).toBe(0);
  await techPage.screenshot({ path: artefactPath("members-technician.png"), fullPage: true });

  // Settings is refused with the 403 page; another workspace's address gives the plain 404.
  const settings = await techPage.goto(`${baseUrl}/w/${slug}/settings`);
  expect(settings?.status()).toBe(403);
  expect(await techPage.getByRole("heading", { level: 1 }).textContent()).toContain("Your role does not open this page");
  const foreign = await techPage.goto(`${baseUrl}/w/quillmere-survey`);
  expect(foreign?.status()).toBe(404);

  // The owner now sees the technician in the list and the acceptance in the logbook.
  await page.goto(`${baseUrl}/w/${slug}/activity`);
  await expect.poll(() => page.locator("table").textContent(), { timeout: 15_000 }).toContain(`${tech.name} joined as technician`);

  await ownerContext.close();
  await techContext.close();
});

test("an unknown address gets a real 404 page", async () => {
  const context = await browser.newContext();
  const page = await context.newPage();
  const response = await page.goto(`${baseUrl}/no-such-page-${tag}`);
  expect(response?.status()).toBe(404);
  expect(await page.getByRole("heading", { level: 1 }).textContent()).toContain("Nothing is charted here");
  await context.close();
});
