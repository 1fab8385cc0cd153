/**
 * Starting a run from the browser, end to end in headless Chromium against the real server,
 * PostgreSQL, the object-storage fake and the background worker: a fresh owner sets up a
 * vehicle with sensors and a site through the JSON API, then uploads simulated captures
 * through the page — a good full tumble that ends with its verdict and appears in the runs
 * list, a file with text in a number column that fails naming its row and column, and a
 * motor-current capture that cannot be sent before the safety cautions are confirmed.
 * Every capture is invented by the simulator; the site's field is the World Magnetic Model's.
 */
import { createRequire } from "node:module";
import { afterAll, afterEach, beforeAll, describe, expect, inject, test } from "vitest";
import type { Browser, BrowserContext, CDPSession, Page } from "playwright-core";
import { magneticReference } from "@/geometry/magnetic-reference";
import type { BodyFace } from "@/geometry/magnetometer-types";
import { simulateCapture, tableToCsv } from "@/geometry/simulator";
import { artefactPath, launchBrowser } from "../support/browser";
import { uniqueTag } from "../support/factories";

const baseUrl = inject("baseUrl");
const tag = uniqueTag();
const owner = { name: "Ailsa Brodie", email: `ailsa-${tag}@tests.example`, password: "north-light-2026" };
const slug = `corrie-${tag}`;
const api = `${baseUrl}/api/workspaces/${slug}`;
// An invented site of our choosing; the World Magnetic Model gives its real field.
const site = { name: "Corrie Field", latitudeDeg: 57.42, longitudeDeg: -4.23, altitudeM: 120 };
const SIX_FACES: BodyFace[] = ["+z", "-z", "+x", "-x", "+y", "-y"];

let browser: Browser;
let context: BrowserContext;
let page: Page;
let devtools: CDPSession | undefined;
const ids = { vehicle: "", boardMag: "", mastMag: "", accel: "", gyro: "", site: "" };

/** The date the page proposes: today in the browser's (and this machine's) time zone. */
function localToday(): string {
  const now = new Date();
  return `${now.getFullYear()}-${String(now.getMonth() + 1).padStart(2, "0")}-${String(now.getDate()).padStart(2, "0")}`;
}

/** A clean full tumble after six still faces, with the site's real field, as CSV text. */
function tumbleCsv(extra: Parameters<typeof simulateCapture>[0] = {}): string {
  const reference = magneticReference(site, new Date(`${localToday()}T12:00:00Z`));
  return tableToCsv(
    simulateCapture({
      seed: 7,
      siteFieldNed: reference.fieldNedMicrotesla,
      holds: { faces: SIX_FACES },
      magnetometers: [{ hardIronOffset: [6, -4, 11], softIron: "mild" }],
      ...extra,
    }).table,
  );
}

async function post<T>(path: string, data: unknown): Promise<T> {
  const response = await page.request.post(`${api}${path}`, { data });
  expect(response.status(), `${path}: ${await response.text()}`).toBe(201);
  return (await response.json()) as T;
}

async function openUploadPage() {
  await page.goto(`${baseUrl}/w/${slug}/runs/new`);
  await page.getByRole("heading", { name: "Upload a capture" }).waitFor();
}

async function pickFile(name: string, text: string, mimeType = "text/csv") {
  await page.locator("#run-file").setInputFiles({ name, mimeType, buffer: Buffer.from(text) });
}

async function columnChoices(): Promise<string[]> {
  return page.locator('[data-testid="preview-column"] select').evaluateAll((selects) => selects.map((s) => (s as HTMLSelectElement).value));
}

/** Records every value the two progress bars take, from inside the page. */
async function recordProgress() {
  await page.evaluate(() => {
    const seen: Record<string, number[]> = {};
    (window as unknown as { __progress: typeof seen }).__progress = seen;
    const note = (element: Element) => {
      const id = element.getAttribute("data-testid");
      const value = element.getAttribute("aria-valuenow");
      if (!id || value === null) return;
      const list = (seen[id] ??= []);
      if (list[list.length - 1] !== Number(value)) list.push(Number(value));
    };
    new MutationObserver((mutations) => {
      for (const mutation of mutations) {
        if (mutation.type === "attributes") note(mutation.target as Element);
        mutation.addedNodes.forEach((node) => {
          if (node instanceof Element) node.querySelectorAll("[role=progressbar]").forEach(note);
        });
      }
    }).observe(document.body, { subtree: true, childList: true, attributes: true, attributeFilter: ["aria-valuenow"] });
  });
}

async function recordedProgress(): Promise<Record<string, number[]>> {
  return page.evaluate(() => (window as unknown as { __progress: Record<string, number[]> }).__progress);
}

/** WCAG 2 A and AA violations axe-core finds in the upload form, as "rule: element" lines. */
async function accessibilityViolations(): Promise<string[]> {
  await page.addScriptTag({ path: createRequire(import.meta.url).resolve("axe-core/axe.min.js") });
  return page.evaluate(async () => {
    const axe = (
      window as unknown as {
        axe: { run: (context: unknown, options: unknown) => Promise<{ violations: { id: string; nodes: { target: string[] }[] }[] }> };
      }
    ).axe;
    const result = await axe.run(
      { include: [["form[aria-label='Start a run']"]] },
      { runOnly: { type: "tag", values: ["wcag2a", "wcag2aa"] } },
    );
    return result.violations.flatMap((v) => v.nodes.map((n) => `${v.id}: ${n.target.join(" ")}`));
  });
}

/** Slows the page's uploads to `kilobytesPerSecond` through the DevTools protocol; null gives full speed again. */
async function throttleUploads(kilobytesPerSecond: number | null) {
  devtools ??= await context.newCDPSession(page);
  const uploadThroughput = kilobytesPerSecond === null ? -1 : kilobytesPerSecond * 1024;
  await devtools.send("Network.emulateNetworkConditions", { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput });
}

async function runsTotal(): Promise<number> {
  const response = await page.request.get(`${api}/runs`);
  return ((await response.json()) as { total: number }).total;
}

beforeAll(async () => {
  browser = await launchBrowser();
  context = await browser.newContext();
  page = await context.newPage();

  // A fresh owner signs up through the page; the rest is set up through the JSON API with the page's cookies.
  await page.goto(`${baseUrl}/sign-up`);
  await page.getByLabel("Your name", { exact: true }).fill(owner.name);
  await page.getByLabel("E-mail", { exact: true }).fill(owner.email);
  await page.getByLabel("Password", { exact: true }).fill(owner.password);
  await page.getByRole("button", { name: "Create account" }).click();
  await page.waitForURL(`${baseUrl}/workspaces/new`);
  const workspace = await page.request.post(`${baseUrl}/api/workspaces`, {
    data: { name: "Corrie Aerial Survey", slug, kind: "operator" },
  });
  expect(workspace.status()).toBe(201);

  ids.vehicle = (
    await post<{ vehicle: { id: string } }>("/vehicles", { name: "Pindlecote hexacopter", kind: "multirotor", serialTag: "HX-07" })
  ).vehicle.id;
  await post("/vehicles", { name: "Vossenby rover", kind: "rover" });
  const sensor = async (body: Record<string, unknown>) =>
    (await post<{ sensor: { id: string } }>(`/vehicles/${ids.vehicle}/sensors`, body)).sensor.id;
  // The board compass is listed first, but the mast module names the file's columns: the hint must win over the order.
  ids.boardMag = await sensor({
    kind: "magnetometer",
    label: "board",
    placement: "internal",
    mountingRotation: "x-forward.z-down",
    units: "uT",
  });
  ids.mastMag = await sensor({
    kind: "magnetometer",
    label: "mast module",
    placement: "external",
    mountingRotation: "x-forward.z-down",
    units: "uT",
    columnHints: ["compass_a.x", "compass_a.y", "compass_a.z"],
  });
  ids.accel = await sensor({
    kind: "accelerometer",
    label: "board",
    placement: "internal",
    mountingRotation: "x-forward.z-down",
    units: "m/s2",
  });
  ids.gyro = await sensor({
    kind: "gyroscope",
    label: "board",
    placement: "internal",
    mountingRotation: "x-forward.z-down",
    units: "rad/s",
  });
  ids.site = (await post<{ site: { id: string } }>("/sites", site)).site.id;
});

// A test that stops half-way leaves neither a slow network nor a stand-in route to the next one.
afterEach(async () => {
  await throttleUploads(null);
  await page.unrouteAll();
});

afterAll(async () => {
  await context?.close();
  await browser?.close();
});

describe("the upload page", () => {
  test("a full tumble is previewed, uploaded with both progress bars to the end, checked, and listed with its verdict", async () => {
    await openUploadPage();
    expect(await page.getByText(/up to 200 MB, 2,000,000 rows and 64 columns/).count()).toBe(1);

    // A file that is not CSV or TSV is refused at once.
    await pickFile("flight-notes.pdf", "%PDF-1.4", "application/pdf");
    await expect.poll(() => page.locator("#run-file-error").textContent()).toContain("is not a CSV or TSV file");

    // The preview, parsed in the worker: comma-separated, every column recognised from its name.
    const csv = tumbleCsv();
    const headers = csv.slice(0, csv.indexOf("\n")).split(",");
    await pickFile("corrie-tumble.csv", csv);
    await expect.poll(() => page.getByTestId("preview-delimiter").textContent()).toBe("comma");
    expect(await columnChoices()).toEqual(headers);
    expect(await page.getByTestId("mapping-problems").count()).toBe(0);

    // Units: the simulator writes µT, m/s², rad/s and seconds; the names do not say so, so they are stated.
    await page.getByLabel("Magnetic field unit").selectOption("uT");
    await page.getByLabel("Acceleration unit").selectOption("m/s2");
    await page.getByLabel("Angular rate unit").selectOption("rad/s");
    await page.getByLabel("Time unit").selectOption("s");

    // The vehicle's sensors fill the slots: compass_a by the mast module's column hints, the others by order.
    await page.getByLabel("Vehicle", { exact: true }).selectOption(ids.vehicle);
    await expect.poll(() => page.locator("#slot-compass_a").inputValue()).toBe(ids.mastMag);
    expect(await page.locator("#slot-accel_a").inputValue()).toBe(ids.accel);
    expect(await page.locator("#slot-gyro_a").inputValue()).toBe(ids.gyro);
    expect(await page.getByLabel("Capture date").inputValue()).toBe(localToday());
    await page.getByLabel("Site", { exact: true }).selectOption(ids.site);
    await page.getByLabel("Title (optional)").fill(`Corrie tumble ${tag}`);
    expect(await page.getByLabel("Magnetometer model").inputValue()).toBe("auto");
    expect(await page.getByTestId("motor-cautions").count()).toBe(0);
    await page.screenshot({ path: artefactPath("upload-form.png"), fullPage: true });
    expect(await accessibilityViolations()).toEqual([]);

    // Uploads are slowed to about 300 kB/s, so the bar has bytes in flight to count.
    await throttleUploads(300);
    await recordProgress();
    await page.getByRole("button", { name: "Upload and check" }).click();
    const verdict = page.getByTestId("run-verdict");
    await verdict.waitFor({ timeout: 60_000 });
    await throttleUploads(null);
    expect(await verdict.getAttribute("data-verdict")).toBe("pass");
    expect(page.url()).toMatch(/\?run=[0-9a-f-]{36}$/);
    const runId = new URL(page.url()).searchParams.get("run")!;

    // Both bars only ever moved forward and reached the end; the upload bar counted the real bytes.
    const seen = await recordedProgress();
    for (const bar of ["upload-progress", "processing-progress"]) {
      const values = seen[bar] ?? [];
      expect(values.at(-1), bar).toBe(100);
      expect(values, bar).toEqual([...values].sort((a, b) => a - b));
    }
    // The upload bar counted bytes in flight (the processing bar's steps depend on how fast the worker is).
    expect(seen["upload-progress"].filter((v) => v > 0 && v < 100).length).toBeGreaterThan(3);
    expect(await page.getByTestId("upload-progress").getAttribute("aria-valuetext")).toContain(`of ${Math.round(csv.length / 1024)} kB`);
    expect(await page.getByTestId("processing-progress").getAttribute("aria-valuetext")).toContain("Ready");
    await page.screenshot({ path: artefactPath("upload.png"), fullPage: true });

    // A reload picks the run up again from the address.
    await page.reload();
    await page.getByTestId("run-verdict").waitFor();
    expect(await page.getByTestId("run-verdict").getAttribute("data-verdict")).toBe("pass");
    expect(await page.getByTestId("run-progress").getAttribute("data-run-id")).toBe(runId);
    expect(await page.getByTestId("upload-progress").getAttribute("aria-valuenow")).toBe("100");

    expect(await page.getByRole("link", { name: "See every check" }).getAttribute("href")).toBe(`/w/${slug}/runs/${runId}`);

    // The runs list shows it with its verdict.
    await page.getByRole("link", { name: "Open the runs list" }).click();
    await page.waitForURL(`${baseUrl}/w/${slug}/runs`);
    const row = page.getByTestId("run-row").filter({ hasText: `Corrie tumble ${tag}` });
    await row.waitFor();
    expect(await row.locator("[data-verdict]").getAttribute("data-verdict")).toBe("pass");
    expect(await row.textContent()).toContain("Pindlecote hexacopter");
    expect(await row.textContent()).toContain(site.name);
  });

  test("an upload cut off on its way to storage is tried again and finishes; a cancelled one leaves no run behind", async () => {
    const csv = tumbleCsv({ seed: 10 });
    const before = await runsTotal();

    // The first PUT to storage is cut off; the page says so and offers to try again.
    let cutOff = 0;
    await page.route(
      (url) => url.pathname.includes("/upload/"),
      async (route) => {
        if (route.request().method() === "PUT" && cutOff === 0) {
          cutOff += 1;
          await route.abort("connectionreset");
        } else await route.continue();
      },
    );
    await openUploadPage();
    await pickFile("corrie-retry.csv", csv);
    await expect.poll(() => page.getByTestId("preview-delimiter").textContent()).toBe("comma");
    await page.getByLabel("Vehicle", { exact: true }).selectOption(ids.vehicle);
    await page.getByRole("button", { name: "Upload and check" }).click();
    await expect.poll(() => page.getByRole("alert").filter({ hasText: "dropped during the upload" }).count()).toBe(1);
    expect(cutOff).toBe(1);
    await page.getByRole("button", { name: "Try again" }).click();
    await page.getByTestId("run-verdict").waitFor({ timeout: 60_000 });
    expect(await runsTotal()).toBe(before + 1);

    // A slow upload cancelled half-way: back to the form, and the run is gone.
    await page.getByRole("button", { name: "Upload another capture" }).click();
    expect(new URL(page.url()).search).toBe("");
    await pickFile("corrie-cancelled.csv", csv);
    await expect.poll(() => page.getByTestId("preview-delimiter").textContent()).toBe("comma");
    await page.getByLabel("Vehicle", { exact: true }).selectOption(ids.vehicle);
    await throttleUploads(50);
    await page.getByRole("button", { name: "Upload and check" }).click();
    await expect
      .poll(async () => Number(await page.getByTestId("upload-progress").getAttribute("aria-valuenow")), { timeout: 10_000 })
      .toBeGreaterThan(2);
    await page.getByRole("button", { name: "Cancel the upload" }).click();
    await expect.poll(() => page.getByTestId("form-error").textContent()).toContain("The upload was cancelled");
    expect(await runsTotal()).toBe(before + 1);
  });

  test("text in a number column ends the run as failed, naming the row and the column, and the file is kept", async () => {
    const lines = tumbleCsv({ seed: 8 }).split("\n");
    // Row 500 of the file (the header is row 1), the y axis of the compass.
    const cells = lines[499].split(",");
    cells[2] = "n/a";
    lines[499] = cells.join(",");
    await openUploadPage();
    await pickFile("corrie-smudged.csv", lines.join("\n"));
    await expect.poll(() => page.getByTestId("preview-delimiter").textContent()).toBe("comma");
    await page.getByLabel("Vehicle", { exact: true }).selectOption(ids.vehicle);
    await expect.poll(() => page.locator("#slot-compass_a").inputValue()).toBe(ids.mastMag);
    await page.getByRole("button", { name: "Upload and check" }).click();

    const failure = page.getByTestId("run-error");
    await failure.waitFor({ timeout: 60_000 });
    const text = (await failure.textContent()) ?? "";
    expect(text).toContain('row 500, column "compass_a.y"');
    expect(text).toContain("n/a");
    expect(await failure.locator("dd").allTextContents()).toEqual(["500", "compass_a.y"]);
    expect(text).toContain("original file was kept");
    await page.screenshot({ path: artefactPath("upload-failed.png"), fullPage: true });
    expect(await page.getByTestId("processing-progress").getAttribute("aria-valuenow")).toBe("100");
    // The kept original can be fetched back.
    const runId = new URL(page.url()).searchParams.get("run")!;
    const original = await page.request.get(`${api}/runs/${runId}/file`);
    expect(original.status()).toBe(200);
    expect(await original.text()).toContain("n/a");
  });

  test("the form reads units from column names, refuses a broken mapping and a motor capture without the safety confirmation, and places the API's field errors", async () => {
    const before = await runsTotal();
    // Opened from the vehicle's page, the vehicle is already chosen.
    await page.goto(`${baseUrl}/w/${slug}/runs/new?vehicle=${ids.vehicle}`);

    // A logger's own column names, with units in brackets.
    const names: Record<string, string> = {
      time: "Time (s)",
      "compass_a.x": "Compass X (uT)",
      "compass_a.y": "Compass Y (uT)",
      "compass_a.z": "Compass Z (uT)",
      "accel_a.x": "Acc X (m/s2)",
      "accel_a.y": "Acc Y (m/s2)",
      "accel_a.z": "Acc Z (m/s2)",
      "gyro_a.x": "Gyro X (rad/s)",
      "gyro_a.y": "Gyro Y (rad/s)",
      "gyro_a.z": "Gyro Z (rad/s)",
      current: "Battery current (A)",
      throttle: "Throttle",
    };
    const csv = tumbleCsv({ seed: 9, currentTest: { maxAmps: 28 } });
    const fields = csv.slice(0, csv.indexOf("\n")).split(",");
    await pickFile("corrie-motors.csv", [fields.map((f) => names[f]).join(","), csv.slice(csv.indexOf("\n") + 1)].join("\n"));
    await expect.poll(() => page.getByTestId("preview-delimiter").textContent()).toBe("comma");
    expect(await columnChoices()).toEqual(fields);
    expect(await page.getByLabel("Vehicle", { exact: true }).inputValue()).toBe(ids.vehicle);
    expect(await page.getByLabel("Magnetic field unit").inputValue()).toBe("uT");
    expect(await page.getByLabel("Acceleration unit").inputValue()).toBe("m/s2");
    expect(await page.getByLabel("Angular rate unit").inputValue()).toBe("rad/s");
    expect(await page.getByLabel("Time unit").inputValue()).toBe("s");
    expect(await page.getByLabel("Current unit").inputValue()).toBe("A");

    // A compass axis left out, then a field given twice: each is said where it is.
    const column = (name: string) => page.getByLabel(`What column “${name}” holds`);
    await column("Compass Y (uT)").selectOption("ignore");
    await expect.poll(() => page.getByTestId("mapping-problems").textContent()).toContain("Compass A needs all three axes");
    await column("Compass Y (uT)").selectOption("compass_a.x");
    await expect
      .poll(() => page.getByRole("alert").filter({ hasText: "compass_a.x is already given to “Compass X (uT)”" }).count())
      .toBe(1);
    await column("Compass Y (uT)").selectOption("compass_a.y");
    expect(await page.getByTestId("mapping-problems").count()).toBe(0);

    // A current column is mapped, so the capture powers the motors: the cautions show and must be confirmed.
    const powers = page.getByLabel("This capture powers the motors (current test)");
    expect(await powers.isChecked()).toBe(true);
    expect(await powers.isDisabled()).toBe(true);
    const cautions = page.getByTestId("motor-cautions");
    expect(await cautions.textContent()).toMatch(
      /propellers off.*restrained.*battery.*clear of the motors.*aviation rules.*maker’s manual.*licensed practice/s,
    );
    await page.getByRole("button", { name: "Upload and check" }).click();
    await expect.poll(() => page.locator("#run-safety-acknowledged-error").textContent()).toContain("confirm the cautions");
    expect(await page.getByTestId("form-error").count()).toBe(1);
    await page.getByLabel(/I confirm this capture was made with propellers off/).check();
    expect(await page.locator("#run-safety-acknowledged-error").count()).toBe(0);
    expect(await runsTotal()).toBe(before);

    // The API's answer to bad input ({error, message, fields}, as documented) lands beside each field;
    // the answer is stood in for here, since the form itself lets none of these through.
    let sent: Record<string, unknown> | null = null;
    await page.route(`${api}/runs`, async (route) => {
      sent = route.request().postDataJSON() as Record<string, unknown>;
      await route.fulfill({
        status: 400,
        json: {
          error: "invalid",
          message: "Some fields need attention.",
          fields: {
            capturedOn: "Give the capture date as YYYY-MM-DD.",
            "units.magnetic": "Magnetic unit not recognised.",
            "columnMapping.Compass Z (uT)": "Map columns to a sensor axis such as compass_a.x.",
            "sensorSlots.compass_a": "Slot compass_a needs a magnetometer.",
            safetyAcknowledged: "This capture powers motors: confirm the safety cautions first.",
            vehicleId: "Choose a vehicle.",
            somethingElse: "A field the form does not show.",
          },
        },
      });
    });
    await page.getByRole("button", { name: "Upload and check" }).click();
    await expect.poll(() => page.locator("#run-captured-on-error").textContent()).toBe("Give the capture date as YYYY-MM-DD.");
    await page.unrouteAll();
    expect(await page.locator("#unit-magnetic-error").textContent()).toBe("Magnetic unit not recognised.");
    expect(await page.locator("#column-3-error").textContent()).toBe("Map columns to a sensor axis such as compass_a.x.");
    expect(await page.locator("#slot-compass_a-error").textContent()).toBe("Slot compass_a needs a magnetometer.");
    expect(await page.locator("#run-safety-acknowledged-error").textContent()).toContain("confirm the safety cautions");
    expect(await page.locator("#run-vehicle-error").textContent()).toBe("Choose a vehicle.");
    expect(await page.getByTestId("form-error").textContent()).toContain("somethingElse: A field the form does not show.");
    // What the form sent: the motor capture with its confirmation, the units read from the names, the sensors by hint and order.
    expect(sent).toMatchObject({
      vehicleId: ids.vehicle,
      siteId: null,
      fileName: "corrie-motors.csv",
      // The header's names go too: the server tells a motor run from them itself.
      columns: fields.map((f) => names[f]),
      powersMotors: true,
      safetyAcknowledged: true,
      model: "auto",
      units: { magnetic: "uT", acceleration: "m/s2", rate: "rad/s", time: "s", current: "A" },
      sensorSlots: { compass_a: ids.boardMag, accel_a: ids.accel, gyro_a: ids.gyro },
    });
    expect((sent as unknown as { columnMapping: Record<string, string> }).columnMapping).toEqual(
      Object.fromEntries(fields.map((f) => [names[f], f])),
    );
    expect(await runsTotal()).toBe(before);
    await page.screenshot({ path: artefactPath("upload-errors.png"), fullPage: true });
  });
});
