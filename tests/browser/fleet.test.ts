/**
 * The fleet pages end to end in headless Chromium against the real server and PostgreSQL:
 * a fresh owner adds vehicles (an empty name is refused next to its field first), opens one,
 * declares a magnetometer mounted with its x axis to the vehicle's right (x-right.z-down), with
 * the picture of its axes following the choice, adds a site, filters the fleet table by text and
 * kind with the filters kept in the address, and creates, uses and revokes an API token.
 */
import { afterAll, beforeAll, expect, inject, test } from "vitest";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { artefactPath, launchBrowser } from "../support/browser";
import { uniqueTag } from "../support/factories";
import { simulateCapture, tableToCsv } from "@/geometry/simulator";

let browser: Browser;
let context: BrowserContext;
let page: Page;
const baseUrl = inject("baseUrl");
const tag = uniqueTag();
const owner = { name: "Maren Holt", email: `maren-${tag}@tests.example`, password: "low-tide-survey-26" };
const slug = `saltmarsh-${tag}`;
const fleetUrl = `${baseUrl}/w/${slug}/vehicles`;

beforeAll(async () => {
  browser = await launchBrowser();
  context = await browser.newContext({ viewport: { width: 1360, height: 900 } });
  page = await context.newPage();
  // Archive and revoke ask for confirmation.
  page.on("dialog", (dialog) => void dialog.accept());
});
afterAll(async () => {
  await context?.close();
  await browser?.close();
});

const vehicleRows = () => page.getByTestId("vehicle-row");

async function addVehicle(name: string, kind: string, serialTag: string) {
  const form = page.getByRole("form", { name: "Add a vehicle" });
  await form.getByLabel("Name", { exact: true }).fill(name);
  await form.getByLabel("Kind", { exact: true }).selectOption(kind);
  await form.getByLabel("Serial or tag").fill(serialTag);
  await form.getByRole("button", { name: "Add the vehicle" }).click();
  await expect
    .poll(() => page.getByRole("status").filter({ hasText: "is in the fleet" }).textContent())
    .toContain(`${name} is in the fleet`);
}

test("an owner signs up and creates a workspace", async () => {
  await page.goto(`${baseUrl}/sign-up`);
  await page.getByLabel("Your name", { exact: true }).fill(owner.name);
  await page.getByLabel("E-mail", { exact: true }).fill(owner.email);
  await page.getByLabel("Password", { exact: true }).fill(owner.password);
  await page.getByRole("button", { name: "Create account" }).click();
  await page.waitForURL(`${baseUrl}/workspaces/new`);
  await page.getByLabel("Name", { exact: true }).fill("Saltmarsh Aerial Survey");
  await page.getByLabel("Address", { exact: true }).fill(slug);
  await page.getByLabel("Kind").selectOption("operator");
  await page.getByRole("button", { name: "Create workspace" }).click();
  await page.waitForURL(`${baseUrl}/w/${slug}`);
});

test("the fleet starts empty and says what to do; an empty name is refused next to its field", async () => {
  await page.getByRole("navigation", { name: "Workspace" }).getByRole("link", { name: "Fleet" }).click();
  await page.waitForURL(fleetUrl);
  await expect.poll(() => page.getByTestId("empty-state").textContent()).toContain("No vehicles yet");
  expect(await vehicleRows().count()).toBe(0);

  await page.getByRole("button", { name: "Add a vehicle" }).click();
  const form = page.getByRole("form", { name: "Add a vehicle" });
  await form.getByRole("button", { name: "Add the vehicle" }).click();
  await expect.poll(() => page.locator("#vehicle-new-name-error").textContent()).toBe("Give the vehicle a name.");
  expect(await form.getByLabel("Name", { exact: true }).getAttribute("aria-invalid")).toBe("true");

  await addVehicle("Pindlecote hexacopter", "multirotor", "HX-0042");
  await addVehicle("Vossenby survey wing", "fixed-wing", "VS-0007");
  await addVehicle("Tesselhorn quad", "multirotor", "TQ-0013");
  await expect.poll(() => vehicleRows().count()).toBe(3);
});

test("a vehicle page declares a magnetometer mounted x-right.z-down, its picture following the select", async () => {
  await page.getByRole("link", { name: "Pindlecote hexacopter", exact: true }).click();
  await page.waitForURL(new RegExp(`/w/${slug}/vehicles/[0-9a-f-]{36}$`));
  const vehicleUrl = page.url();
  expect(await page.getByRole("heading", { level: 2, name: /Pindlecote hexacopter/ }).count()).toBe(1);
  await expect.poll(() => page.getByTestId("empty-state").filter({ hasText: "No sensors declared" }).count()).toBe(1);
  // Its runs, none yet, with a way to start one for this vehicle.
  await expect.poll(() => page.getByTestId("empty-state").filter({ hasText: "No runs yet" }).count()).toBe(1);
  const vehicleId = vehicleUrl.split("/").pop();
  expect(await page.getByRole("link", { name: "Start a run" }).first().getAttribute("href")).toBe(
    `/w/${slug}/runs/new?vehicle=${vehicleId}`,
  );

  await page.getByRole("button", { name: "Add a sensor" }).click();
  const form = page.getByRole("form", { name: "Add a sensor" });
  await form.getByLabel("Sensor", { exact: true }).selectOption("magnetometer");
  await form.getByLabel("Label", { exact: true }).fill("mast module");
  await form.getByLabel("Placement").selectOption("external");
  const picture = form.getByTestId("mounting-picture");
  expect(await picture.getAttribute("data-mounting")).toBe("x-forward.z-down");
  await form.getByLabel("Declared mounting", { exact: true }).selectOption("x-right.z-down");
  await expect.poll(() => picture.getAttribute("aria-label")).toContain("module x → vehicle right, module z → down");
  expect(await picture.locator('[data-axis="module-x"]').getAttribute("data-points")).toBe("right");
  expect(await form.getByTestId("mounting-euler").textContent()).toBe("Euler angles (roll, pitch, yaw): 0°, 0°, 90°");
  await form.getByLabel("Units it logs in").selectOption("mG");
  await form.getByLabel("Usual CSV columns").fill("ext_mx, ext_my, ext_mz");
  await form.getByRole("button", { name: "Add the sensor" }).click();

  const row = page.getByTestId("sensor-row").filter({ hasText: "mast module" });
  await expect.poll(() => row.count()).toBe(1);
  const text = await row.textContent();
  expect(text).toContain("Magnetometer");
  expect(text).toContain("External");
  expect(text).toContain("x → right, z → down");
  expect(text).toContain("ext_mx, ext_my, ext_mz");
  await page.screenshot({ path: artefactPath("vehicle.png"), fullPage: true });

  // It is stored, not only drawn: a reload shows the same declaration.
  await page.reload();
  await expect.poll(() => page.getByTestId("sensor-row").filter({ hasText: "x → right, z → down" }).count()).toBe(1);

  // Someone else's or a made-up vehicle is a plain 404.
  const missing = await page.goto(`${baseUrl}/w/${slug}/vehicles/00000000-0000-4000-8000-000000000000`);
  expect(missing?.status()).toBe(404);
});

test("a site is added with its coordinates", async () => {
  await page.goto(`${baseUrl}/w/${slug}/sites`);
  expect(await page.getByText("World Magnetic Model").count()).toBeGreaterThan(0);
  await page.getByRole("button", { name: "Add a site" }).click();
  const form = page.getByRole("form", { name: "Add a site" });
  await form.getByLabel("Name", { exact: true }).fill("Saltings east field");
  await form.getByRole("button", { name: "Add the site" }).click();
  // An empty latitude would read as the equator; it is refused next to the field instead.
  await expect.poll(() => page.locator("#site-new-lat-error").textContent()).toContain("latitude");
  await form.getByLabel("Latitude (°)").fill("53.0621");
  await form.getByLabel("Longitude (°)").fill("0.8437");
  await form.getByLabel("Altitude (m)").fill("4");
  await form.getByRole("button", { name: "Add the site" }).click();
  const row = page.getByTestId("site-row").filter({ hasText: "Saltings east field" });
  await expect.poll(() => row.count()).toBe(1);
  expect(await row.textContent()).toContain("53.06210");
});

test("the fleet table filters by text and kind, and the filters survive a reload", async () => {
  await page.goto(fleetUrl);
  await expect.poll(() => vehicleRows().count()).toBe(3);

  await page.getByLabel("Search", { exact: true }).fill("pindlecote");
  await expect.poll(() => vehicleRows().count()).toBe(1);
  expect(await vehicleRows().first().textContent()).toContain("Pindlecote hexacopter");
  await expect.poll(() => new URL(page.url()).searchParams.get("q")).toBe("pindlecote");
  await page.reload();
  await expect.poll(() => vehicleRows().count()).toBe(1);
  expect(await page.getByLabel("Search", { exact: true }).inputValue()).toBe("pindlecote");

  await page.getByLabel("Search", { exact: true }).fill("");
  await expect.poll(() => vehicleRows().count()).toBe(3);
  await page.getByLabel("Kind", { exact: true }).selectOption("fixed-wing");
  await expect.poll(() => vehicleRows().count()).toBe(1);
  expect(await vehicleRows().first().textContent()).toContain("Vossenby survey wing");
  await page.getByLabel("Kind", { exact: true }).selectOption("multirotor");
  await expect.poll(() => vehicleRows().count()).toBe(2);

  // Sorted by the server: by name A to Z first, a click on the header turns it round.
  await expect.poll(() => vehicleRows().first().textContent()).toContain("Pindlecote hexacopter");
  await page.getByRole("button", { name: /^Name/ }).click();
  await expect.poll(() => vehicleRows().first().textContent()).toContain("Tesselhorn quad");
  expect(new URL(page.url()).searchParams.get("order")).toBe("desc");
  await page.screenshot({ path: artefactPath("fleet.png"), fullPage: true });

  await page.getByLabel("Search", { exact: true }).fill("vossenby");
  await expect.poll(() => page.getByTestId("empty-state").textContent()).toContain("No vehicle matches these filters");
  expect(await vehicleRows().count()).toBe(0);
  await page.getByRole("button", { name: "Clear the filters" }).click();
  await expect.poll(() => vehicleRows().count()).toBe(3);
});

test("the runs page is empty and offers to start a run", async () => {
  await page.goto(`${baseUrl}/w/${slug}/runs`);
  await expect.poll(() => page.getByTestId("empty-state").textContent()).toContain("No runs yet");
  expect(await page.getByRole("link", { name: "Start a run" }).count()).toBeGreaterThan(0);
  // The vehicle filter lists the fleet.
  await expect.poll(() => page.getByLabel("Vehicle", { exact: true }).locator("option").count()).toBe(4);
});

test("a run registered by a script shows up, is followed while it is processed, and filters by verdict", async () => {
  const api = `${baseUrl}/api/workspaces/${slug}`;
  const vehicles = (await (await page.request.get(`${api}/vehicles?search=tesselhorn`)).json()) as { items: { id: string }[] };
  const sites = (await (await page.request.get(`${api}/sites`)).json()) as { sites: { id: string }[] };
  const csv = tableToCsv(simulateCapture({ seed: 31, pathSeconds: 30 }).table);
  const created = await page.request.post(`${api}/runs`, {
    data: {
      vehicleId: vehicles.items[0].id,
      siteId: sites.sites[0].id,
      capturedOn: "2026-05-04",
      title: "Pre-season check",
      fileName: "tesselhorn-tumble.csv",
      fileSize: Buffer.byteLength(csv),
    },
  });
  expect(created.status()).toBe(201);
  const { run, upload } = (await created.json()) as { run: { id: string }; upload: { url: string } };

  // The list is open before the file arrives; it follows the run without a reload.
  await page.goto(`${baseUrl}/w/${slug}/runs`);
  const row = page.getByTestId("run-row").filter({ hasText: "Pre-season check" });
  await expect.poll(() => row.textContent()).toContain("Waiting for the file");
  expect(await row.getByRole("link", { name: "Pre-season check" }).getAttribute("href")).toBe(`/w/${slug}/runs/${run.id}`);
  expect(await row.textContent()).toContain("Saltings east field");
  expect(await row.textContent()).toContain(owner.name);

  const put = await fetch(upload.url, { method: "PUT", body: csv, headers: { "content-type": "text/csv" } });
  expect(put.ok).toBe(true);
  expect((await page.request.post(`${api}/runs/${run.id}/uploaded`)).status()).toBe(202);
  await expect.poll(() => row.locator("[data-verdict]").count(), { timeout: 60_000 }).toBe(1);
  const status = (await (await page.request.get(`${api}/runs/${run.id}/status`)).json()) as { status: string; verdict: string };
  expect(status.status).toBe("done");
  expect(await row.locator("[data-verdict]").getAttribute("data-verdict")).toBe(status.verdict);
  await page.screenshot({ path: artefactPath("runs.png"), fullPage: true });

  // Filtering by that verdict keeps the run; another verdict leaves nothing.
  await page.getByLabel("Verdict", { exact: true }).selectOption(status.verdict);
  await expect.poll(() => new URL(page.url()).searchParams.get("verdict")).toBe(status.verdict);
  await expect.poll(() => page.getByTestId("run-row").count()).toBe(1);
  await page.getByLabel("Verdict", { exact: true }).selectOption(status.verdict === "fail" ? "pass" : "fail");
  await expect.poll(() => page.getByTestId("empty-state").textContent()).toContain("No run matches these filters");

  // The vehicle's own page lists it too; another vehicle's does not.
  await page.goto(`${baseUrl}/w/${slug}/vehicles/${vehicles.items[0].id}`);
  await expect.poll(() => page.getByTestId("run-row").filter({ hasText: "Pre-season check" }).count()).toBe(1);
  const pindlecote = (await (await page.request.get(`${api}/vehicles?search=pindlecote`)).json()) as { items: { id: string }[] };
  await page.goto(`${baseUrl}/w/${slug}/vehicles/${pindlecote.items[0].id}`);
  await expect.poll(() => page.getByTestId("empty-state").filter({ hasText: "No runs yet" }).count()).toBe(1);
  expect(await page.getByTestId("run-row").count()).toBe(0);
});

test("an API token works for a script until it is revoked", async () => {
  await page.goto(`${baseUrl}/account/tokens`);
  await page.getByLabel("Token name").fill("bench rig");
  await page.getByRole("button", { name: "Create the token" }).click();
  const secretBox = page.getByTestId("new-token-secret");
  await expect.poll(() => secretBox.count()).toBe(1);
  const secret = (await secretBox.textContent())!.trim();
  expect(secret).toMatch(/^lox_\S{20,}$/);
  expect(await page.getByText("it will not be shown again").count()).toBe(1);
  expect(await page.getByTestId("curl-example").textContent()).toContain(`Authorization: Bearer ${secret}`);
  expect(await page.getByTestId("token-row").filter({ hasText: "bench rig" }).count()).toBe(1);

  const me = await fetch(`${baseUrl}/api/me`, { headers: { authorization: `Bearer ${secret}` } });
  expect(me.status).toBe(200);
  const body = (await me.json()) as { user: { email: string } };
  expect(body.user.email).toBe(owner.email);

  // The secret is never shown again: a reload lists the token by its first characters only.
  await page.reload();
  expect(await page.getByTestId("new-token-secret").count()).toBe(0);
  expect(await page.content()).not.toContain(secret);

  await page.getByRole("button", { name: "Revoke bench rig" }).click();
  await expect.poll(() => page.getByTestId("token-row").count()).toBe(0);
  const after = await fetch(`${baseUrl}/api/me`, { headers: { authorization: `Bearer ${secret}` } });
  expect(after.status).toBe(401);
});
