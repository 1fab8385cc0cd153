/**
 * A class session end to end in headless Chromium against the real server, PostgreSQL and
 * worker, with one browser context per person: an instructor starts a session from a scenario,
 * a student joins with the code the console shows, the instructor steps the capture and the
 * student's screen shows coverage growing and the verdict flipping from fail to pass; a quick
 * question is asked, answered and tallied; the answer is revealed; the screen is frozen; the
 * student's connection drops and catches up; the session ends and its run opens. A guest joins
 * a session that allows guests (and is refused where it does not), with the motor cautions on
 * both screens. The scenario builder checks its fields, previews, saves, duplicates and deletes.
 * Scenarios are invented (demo values) at a site of our choosing (WMM2025 field).
 */
import { createRequire } from "node:module";
import { afterAll, beforeAll, expect, inject, test } from "vitest";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { DEFAULT_SCENARIO, type ScenarioSpec } from "@/geometry/scenario";
import { createScenario } from "@/lib/data/scenarios";
import { closeDb } from "@/lib/db";
import { stopQueue } from "@/lib/jobs/queue";
import { artefactPath, launchBrowser } from "../support/browser";
import { TEST_PASSWORD, addMember, makeUser, makeWorkspace } from "../support/factories";

const baseUrl = inject("baseUrl");
let browser: Browser;
let slug = "";
const people = {} as Record<"instructor" | "student", { email: string; id: string; name: string }>;

const SITE = { name: "Saltmarsh strip", latitudeDeg: 53.05, longitudeDeg: 0.35, altitudeM: 12 };
/** A full tumble of 90 s at 25 Hz (2,250 samples): coverage fills as it plays and the verdict ends at pass. */
const FULL_TURN: ScenarioSpec = { ...DEFAULT_SCENARIO, site: SITE, date: "2026-11-20", seed: 7 };
/** The same with a motor run at the end, for the cautions. */
const MOTOR_RUN: ScenarioSpec = { ...FULL_TURN, pathSeconds: 40, currentCoupling: { perAmpMicrotesla: [0.5, -0.2, 0.7], maxAmps: 25 } };
const FULL_TURN_ANSWER = "Nothing is wrong: the rotation covers the whole sphere and the field matches the model.";

beforeAll(async () => {
  const owner = await makeUser("classowner");
  const workspace = await makeWorkspace(owner, "classroom");
  slug = workspace.slug;
  const instructor = await makeUser("classinstructor");
  const student = await makeUser("classstudent");
  await addMember(workspace, instructor, "instructor");
  await addMember(workspace, student, "student");
  Object.assign(people, { instructor, student });
  await createScenario(workspace.id, instructor.id, {
    name: "Full turn on the saltmarsh",
    description: "Watch the sphere fill as the vehicle is turned.",
    spec: FULL_TURN,
    answer: FULL_TURN_ANSWER,
  });
  await createScenario(workspace.id, instructor.id, {
    name: "Motors on the bench",
    description: "A short tumble, then the motors run with the vehicle strapped down.",
    spec: MOTOR_RUN,
    answer: "The wiring's field grows with the current.",
  });
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await stopQueue();
  await closeDb();
});

async function newPage(options: { width?: number; colorScheme?: "light" | "dark" } = {}): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({
    viewport: { width: options.width ?? 1280, height: 900 },
    colorScheme: options.colorScheme ?? "light",
  });
  return { context, page: await context.newPage() };
}

async function signIn(page: Page, email: string, next: string): Promise<void> {
  await page.goto(`${baseUrl}/sign-in?next=${encodeURIComponent(next)}`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(TEST_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(`${baseUrl}${next}`);
}

/** Start a session from the classroom page's scenario card; returns the console's session id and join code. */
async function startSession(
  page: Page,
  scenarioName: string,
  options: { guests?: boolean } = {},
): Promise<{ sessionId: string; code: string }> {
  await page.goto(`${baseUrl}/w/${slug}/classroom`);
  const card = page.locator(`[data-testid="scenario-card"][data-scenario="${scenarioName}"]`);
  await card.getByRole("button", { name: `Start a session with ${scenarioName}` }).click();
  if (options.guests) await card.getByLabel(/Let guests join/).check();
  await card.getByRole("button", { name: "Start the session" }).click();
  await page.waitForURL(/\/classroom\/sessions\/[0-9a-f-]{36}$/);
  const sessionId = page.url().split("/").pop()!;
  await page.getByTestId("join-code").waitFor();
  const code = (await page.getByTestId("join-code").textContent())!.trim();
  expect(code).toMatch(/^[A-Z0-9]{6}$/);
  return { sessionId, code };
}

const viewState = (page: Page) =>
  page.getByTestId("live-view").evaluate((el) => ({
    position: Number(el.getAttribute("data-position")),
    verdict: el.getAttribute("data-verdict"),
    coverage: el.querySelector('[data-testid="live-coverage"]')?.textContent ?? "",
  }));

const percent = (text: string) => Number(text.replace("%", ""));

async function axeSerious(page: Page): Promise<string[]> {
  await page.addScriptTag({ path: createRequire(import.meta.url).resolve("axe-core/axe.min.js") });
  const result = await page.evaluate(async () => {
    const axe = (
      window as unknown as {
        axe: {
          run: (context: Document, options: object) => Promise<{ violations: { id: string; impact: string | null; nodes: unknown[] }[] }>;
        };
      }
    ).axe;
    return axe.run(document, { resultTypes: ["violations"] });
  });
  return result.violations.filter((v) => v.impact === "serious" || v.impact === "critical").map((v) => `${v.id} (${v.nodes.length})`);
}

test("an instructor runs a session; a student joins with the code, watches the verdict flip, answers, and sees the answer", async () => {
  const teacher = await newPage();
  await signIn(teacher.page, people.instructor.email, `/w/${slug}/classroom`);
  expect(await teacher.page.getByRole("navigation", { name: "Workspace" }).getByRole("link", { name: "Classroom" }).count()).toBe(1);
  const { sessionId, code } = await startSession(teacher.page, "Full turn on the saltmarsh");
  const consolePage = teacher.page;
  expect(await consolePage.getByTestId("join-qr").count()).toBe(1);
  // The host sees the answer from the start; the class does not.
  expect(await consolePage.getByTestId("console-answer").textContent()).toContain(FULL_TURN_ANSWER);

  // The student sees the session listed in the workspace (in the dark scheme, to check it too), then joins
  // with the code, typed in lower case with a space, as people do.
  const pupil = await newPage({ colorScheme: "dark" });
  await signIn(pupil.page, people.student.email, `/w/${slug}/classroom`);
  await expect.poll(() => pupil.page.getByTestId("session-row").count()).toBe(1);
  expect(await pupil.page.getByTestId("session-row").textContent()).toContain("Full turn on the saltmarsh");
  expect(await pupil.page.getByRole("link", { name: "Compose a scenario" }).count()).toBe(0);
  await pupil.page.getByRole("link", { name: "Join with a code" }).click();
  await pupil.page.waitForURL(`${baseUrl}/join`);
  await pupil.page.getByLabel("Session code").fill(`${code.slice(0, 3).toLowerCase()} ${code.slice(3).toLowerCase()}`);
  await pupil.page.getByRole("button", { name: "Join" }).click();
  await pupil.page.waitForURL(`${baseUrl}/live/${sessionId}`);
  const viewer = pupil.page;
  await expect.poll(() => viewer.getByTestId("connection").getAttribute("data-status"), { timeout: 15_000 }).toBe("live");
  await expect.poll(() => consolePage.getByTestId("participant-count").textContent(), { timeout: 15_000 }).toMatch(/^1 participant/);
  expect(await viewer.getByTestId("revealed-answer").count()).toBe(0);
  expect((await viewState(viewer)).position).toBe(0);
  expect(await viewer.getByTestId("live-waiting").textContent()).toMatch(/not started/);

  // Step 30 s of capture: part of the sphere is covered, and the verdict is fail.
  await consolePage.getByLabel("Seconds of capture per step").selectOption("30");
  await consolePage.getByRole("button", { name: "Step 30 s" }).click();
  await expect.poll(async () => (await viewState(viewer)).position, { timeout: 15_000 }).toBe(750);
  const early = await viewState(viewer);
  expect(early.verdict).toBe("fail");
  expect(percent(early.coverage)).toBeLessThan(60);
  await viewer.screenshot({ path: artefactPath("classroom-viewer-early.png"), fullPage: true });

  // Two more steps reach the end: coverage is complete and the verdict has flipped to pass.
  await consolePage.getByRole("button", { name: "Step 30 s" }).click();
  await expect.poll(async () => (await viewState(viewer)).position, { timeout: 15_000 }).toBe(1500);
  await consolePage.getByRole("button", { name: "Step 30 s" }).click();
  await expect.poll(async () => (await viewState(viewer)).position, { timeout: 15_000 }).toBe(2250);
  const late = await viewState(viewer);
  expect(late.verdict).toBe("pass");
  expect(percent(late.coverage)).toBeGreaterThan(percent(early.coverage));
  expect(await viewer.getByTestId("live-verdict").textContent()).toMatch(/Pass/);
  // The console shows the same state.
  await expect.poll(() => consolePage.getByTestId("live-view").getAttribute("data-position")).toBe("2250");

  // A quick question: asked on the console, answered with one click, tallied live with the student's name.
  const composer = consolePage.getByTestId("question-composer");
  await composer.getByLabel("Question").fill("Can this calibration be used?");
  await composer.getByLabel("Choice 1", { exact: true }).fill("Yes, it is sound");
  await composer.getByLabel("Choice 2", { exact: true }).fill("No, never turned over");
  await composer.getByLabel("Choice 3", { exact: true }).fill("No, a module against its declaration");
  await composer.getByRole("button", { name: "Ask the class" }).click();
  const card = viewer.getByTestId("question-card");
  await card.waitFor({ timeout: 15_000 });
  expect(await card.textContent()).toContain("Can this calibration be used?");
  await card.getByRole("button", { name: /Yes, it is sound/ }).click();
  await expect.poll(() => card.getByRole("button", { name: /Yes, it is sound/ }).getAttribute("aria-pressed")).toBe("true");
  const tally = consolePage.getByTestId("tally-question").first();
  await expect.poll(() => tally.getByTestId("tally-row").first().getAttribute("data-count"), { timeout: 15_000 }).toBe("1");
  await expect.poll(() => tally.getByTestId("tally-answer").first().textContent()).toContain(people.student.name);
  expect(await tally.getByTestId("tally-answer").first().textContent()).toContain("Yes, it is sound");
  // Changing the answer moves the count.
  await card.getByRole("button", { name: /never turned over/ }).click();
  await expect.poll(() => tally.getByTestId("tally-row").nth(1).getAttribute("data-count"), { timeout: 15_000 }).toBe("1");
  expect(await tally.getByTestId("tally-row").first().getAttribute("data-count")).toBe("0");

  // The instructor reveals the answer; the student sees it.
  await consolePage.getByRole("button", { name: "Reveal the answer" }).click();
  await viewer.getByTestId("revealed-answer").waitFor({ timeout: 15_000 });
  expect(await viewer.getByTestId("revealed-answer").textContent()).toContain(FULL_TURN_ANSWER);

  // Freeze: the student's screen says so; unfreeze clears it.
  await consolePage.getByRole("button", { name: "Freeze the screens" }).click();
  await viewer.getByTestId("frozen-notice").waitFor({ timeout: 15_000 });
  await consolePage.screenshot({ path: artefactPath("classroom-console.png"), fullPage: true });
  await viewer.screenshot({ path: artefactPath("classroom-viewer.png"), fullPage: true });
  expect(await axeSerious(consolePage)).toEqual([]);
  expect(await axeSerious(viewer)).toEqual([]);
  await consolePage.getByRole("button", { name: "Unfreeze the screens" }).click();
  await expect.poll(() => viewer.getByTestId("frozen-notice").count(), { timeout: 15_000 }).toBe(0);

  // The student's network drops (the browser goes offline): the page says it is reconnecting, and
  // catches up with what happened meanwhile as soon as it is back.
  await pupil.context.setOffline(true);
  await expect.poll(() => viewer.getByTestId("connection").getAttribute("data-status"), { timeout: 30_000 }).toBe("reconnecting");
  expect(await viewer.getByTestId("reconnecting").textContent()).toMatch(/Reconnecting/);
  await consolePage.getByRole("button", { name: "Restart" }).click();
  await expect.poll(() => consolePage.getByTestId("live-view").getAttribute("data-position")).toBe("0");
  await pupil.context.setOffline(false);
  await expect.poll(() => viewer.getByTestId("connection").getAttribute("data-status"), { timeout: 30_000 }).toBe("live");
  await expect.poll(async () => (await viewState(viewer)).position, { timeout: 15_000 }).toBe(0);

  // A reload loses nothing: the revealed answer and the question (with the student's choice) are back.
  await viewer.reload();
  await viewer.getByTestId("revealed-answer").waitFor({ timeout: 15_000 });
  await expect
    .poll(() =>
      viewer
        .getByTestId("question-card")
        .getByRole("button", { name: /never turned over/ })
        .getAttribute("aria-pressed"),
    )
    .toBe("true");

  // The session ends: both screens say so, and the saved run opens for the student.
  await consolePage.getByRole("button", { name: "End the session…" }).click();
  await consolePage.getByRole("button", { name: "End the session", exact: true }).click();
  await consolePage.getByTestId("session-ended").waitFor({ timeout: 15_000 });
  await viewer.getByTestId("viewer-ended").waitFor({ timeout: 15_000 });
  await consolePage.getByTestId("saved-run-link").waitFor({ timeout: 30_000 });
  const runLink = viewer.getByTestId("viewer-ended").getByRole("link", { name: /reopen it/ });
  await runLink.waitFor({ timeout: 30_000 });
  await runLink.click();
  await viewer.waitForURL(/\/w\/[^/]+\/runs\/[0-9a-f-]{36}$/);
  await viewer.getByTestId("run-page").waitFor();

  await teacher.context.close();
  await pupil.context.close();
});

test("a guest joins a session that allows guests, sees the motor cautions, and is refused where guests are not allowed", async () => {
  const teacher = await newPage();
  await signIn(teacher.page, people.instructor.email, `/w/${slug}/classroom`);
  const { code } = await startSession(teacher.page, "Motors on the bench", { guests: true });
  expect(await teacher.page.getByTestId("run-safety-cautions").count()).toBe(1);

  // A guest: no account; the QR code's address fills the code box; a name is needed.
  const guest = await newPage({ width: 420 });
  await guest.page.goto(`${baseUrl}/join?code=${code}`);
  expect(await guest.page.getByLabel("Session code").inputValue()).toBe(code);
  await guest.page.getByRole("button", { name: "Join" }).click();
  await expect.poll(() => guest.page.locator("#join-name-error").textContent()).toMatch(/Give a name/);
  await guest.page.getByLabel("Your name").fill("Gull Watcher");
  await guest.page.getByRole("button", { name: "Join" }).click();
  await guest.page.waitForURL(/\/live\/[0-9a-f-]{36}$/);
  await guest.page.getByTestId("live-viewer").waitFor({ timeout: 15_000 });
  expect(await guest.page.getByTestId("run-safety-cautions").count()).toBe(1);
  await expect.poll(() => teacher.page.getByTestId("participant-count").textContent(), { timeout: 15_000 }).toMatch(/^1 participant/);
  await guest.page.screenshot({ path: artefactPath("classroom-guest-phone.png"), fullPage: true });

  // A wrong code, and a members-only session: each refusal is said beside the code.
  const stranger = await newPage();
  await stranger.page.goto(`${baseUrl}/join`);
  await stranger.page.getByLabel("Session code").fill("ZZZZZZ");
  await stranger.page.getByLabel("Your name").fill("Passer-by");
  await stranger.page.getByRole("button", { name: "Join" }).click();
  await expect.poll(() => stranger.page.locator("#join-code-error").textContent()).toMatch(/No live session has that code/);
  const { code: membersOnly } = await startSession(teacher.page, "Full turn on the saltmarsh");
  await stranger.page.getByLabel("Session code").fill(membersOnly);
  await stranger.page.getByRole("button", { name: "Join" }).click();
  await expect.poll(async () => (await stranger.page.getByTestId("join-form").textContent()) ?? "").toMatch(/Sign in to join this session/);
  expect(await stranger.page.getByRole("link", { name: "Sign in" }).getAttribute("href")).toContain(
    encodeURIComponent(`/join?code=${membersOnly}`),
  );
  // Without joining, the class view sends the stranger to the join page.
  await stranger.page.goto(guest.page.url());
  await stranger.page.getByTestId("viewer-refused").waitFor({ timeout: 15_000 });

  await teacher.context.close();
  await guest.context.close();
  await stranger.context.close();
});

test("the scenario builder checks each field, previews at once, saves, duplicates and deletes", async () => {
  const { context, page } = await newPage({ width: 1440 });
  await signIn(page, people.instructor.email, `/w/${slug}/classroom`);
  await page.locator('[data-testid="scenario-card"]').first().waitFor();
  await page.getByTestId("session-row").first().waitFor();
  await page.screenshot({ path: artefactPath("classroom-list.png"), fullPage: true });
  await page.getByRole("link", { name: "Compose a scenario" }).click();
  await page.waitForURL(`${baseUrl}/w/${slug}/classroom/scenarios/new`);

  // The World Magnetic Model's field for the default site, and a preview of the default scenario (a sound one).
  await expect.poll(() => page.getByTestId("expected-field").textContent()).toMatch(/expects [\d.]+ µT here, inclination [\d.]+°/);
  await expect.poll(() => page.getByTestId("preview-status").textContent(), { timeout: 30_000 }).toMatch(/made in \d+ ms/);
  const preview = page.getByTestId("scenario-preview");
  expect(await preview.getByTestId("live-view").getAttribute("data-verdict")).toBe("pass");

  // Never turned over: the preview follows at once and fails.
  await page.getByText("Upper half only", { exact: true }).click();
  await expect.poll(() => preview.getByTestId("live-view").getAttribute("data-verdict"), { timeout: 30_000 }).toBe("fail");

  // A bad latitude is refused beside its field, and the preview waits for a good one.
  await page.getByLabel("Latitude").fill("95");
  await expect.poll(() => page.locator("#field-spec-site-latitudeDeg-error").textContent()).toMatch(/between -90° and 90°/);
  await expect.poll(() => page.getByTestId("preview-status").textContent()).toMatch(/Correct the marked fields/);
  await page.getByLabel("Latitude").fill("53.05");
  await expect.poll(() => page.locator("#field-spec-site-latitudeDeg-error").count()).toBe(0);

  // A second compass mounted against its declaration, and custom soft iron with one bad entry.
  await page.getByRole("checkbox", { name: "A second compass" }).check();
  await page.getByLabel("Mounted at", { exact: true }).selectOption("x-right.z-down");
  await page.getByLabel("Declared as", { exact: true }).selectOption("x-forward.z-down");
  await expect
    .poll(() => page.getByTestId("scenario-form").textContent())
    .toContain("Mounted module x → vehicle right, module z → down, but declared module x → vehicle forward, module z → down");
  await page.getByText("Custom 3×3", { exact: true }).click();
  await page.getByLabel("Soft iron, row 1, column 2", { exact: true }).fill("0.9");
  await expect.poll(() => page.getByTestId("scenario-form").textContent()).toMatch(/Row 1, column 2: Give a value between -0.5 and 0.5/);
  await page.getByLabel("Soft iron, row 1, column 2", { exact: true }).fill("0.04");
  // Its mirror follows.
  expect(await page.getByLabel("Soft iron, row 2, column 1 (mirrors the entry across the diagonal)").inputValue()).toBe("0.04");

  // Saving without a name or an answer: both are asked for beside their fields.
  await page.getByRole("button", { name: "Save the new scenario" }).click();
  await expect.poll(() => page.locator("#field-name-error").textContent()).toMatch(/Name the scenario/);
  expect(await page.locator("#field-answer-error").textContent()).toMatch(/Say what is wrong/);
  // A name already taken is refused by the server, and its message lands beside the name.
  await page.getByLabel("Name", { exact: true }).fill("Full turn on the saltmarsh");
  await page
    .getByLabel("The answer: what is wrong, in words")
    .fill("Never turned over, and the mast module is mounted with its x to the right but declared aligned with the vehicle.");
  await page.getByRole("button", { name: "Save the new scenario" }).click();
  await expect.poll(() => page.locator("#field-name-error").textContent()).toMatch(/.+/);
  await page.screenshot({ path: artefactPath("classroom-builder.png"), fullPage: true });
  await page.getByLabel("Name", { exact: true }).fill("Half a sphere and a turned module");
  await page.getByRole("button", { name: "Save the new scenario" }).click();
  await page.waitForURL(/\/classroom\/scenarios\/[0-9a-f-]{36}\?saved=1$/);
  await expect.poll(() => page.getByRole("status").filter({ hasText: "Scenario saved." }).count()).toBe(1);
  expect(await page.getByLabel("Mounted at", { exact: true }).inputValue()).toBe("x-right.z-down");

  // Duplicate, then delete the copy.
  await page.getByRole("button", { name: "Duplicate Half a sphere and a turned module" }).click();
  await page.waitForURL(/\?copied=1$/);
  await expect.poll(() => page.getByLabel("Name", { exact: true }).inputValue()).toMatch(/\(copy\)/);
  const copyName = await page.getByLabel("Name", { exact: true }).inputValue();
  await page.getByRole("button", { name: `Delete ${copyName}` }).click();
  await page
    .getByRole("group", { name: `Delete ${copyName}?` })
    .getByRole("button", { name: "Delete" })
    .click();
  await page.waitForURL(/\/classroom\?deleted=/);
  await expect
    .poll(() => page.locator('[data-testid="scenario-card"]').evaluateAll((cards) => cards.map((c) => c.getAttribute("data-scenario"))))
    .toEqual(expect.arrayContaining(["Half a sphere and a turned module"]));
  expect(await page.locator(`[data-testid="scenario-card"][data-scenario="${copyName}"]`).count()).toBe(0);
  expect(await axeSerious(page)).toEqual([]);
  await context.close();
});
