import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { magneticReference } from "@/geometry/magnetic-reference";
import type { BodyFace } from "@/geometry/magnetometer-types";
import { simulateCapture, tableToCsv } from "@/geometry/simulator";

const root = path.resolve(__dirname, "../..");
let folder = "";

/** Runs the CLI as `npm run fit` does (tsx on scripts/fit.ts). */
function fit(...args: string[]) {
  const result = spawnSync(process.execPath, ["--import", "tsx", path.join(root, "scripts/fit.ts"), ...args], {
    cwd: root,
    encoding: "utf8",
    timeout: 120_000,
  });
  return { code: result.status, stdout: result.stdout, stderr: result.stderr };
}

function write(name: string, text: string): string {
  const file = path.join(folder, name);
  writeFileSync(file, text);
  return file;
}

// An invented site; the simulator is given the World Magnetic Model's field there.
const site = { latitudeDeg: -33.9, longitudeDeg: 18.4, altitudeM: 20 };
const date = new Date("2026-02-01T00:00:00Z");
const SIX: BodyFace[] = ["+z", "-z", "+x", "-x", "+y", "-y"];

beforeAll(() => {
  folder = mkdtempSync(path.join(tmpdir(), "loxodrome-fit-"));
});
afterAll(() => {
  rmSync(folder, { recursive: true, force: true });
});

describe("npm run fit", () => {
  test("a good capture prints one JSON document with the contract keys", () => {
    const reference = magneticReference(site, date);
    const { table, truth } = simulateCapture({
      seed: 21,
      siteFieldNed: reference.fieldNedMicrotesla,
      holds: { faces: SIX },
      accelerometer: { offset: [0.2, -0.1, 0.15], scale: [1.01, 0.995, 1.02] },
      magnetometers: [{ hardIronOffset: [10, -4, 7], softIron: "mild" }, { hardIronOffset: [-3, 2, 5] }],
    });
    const file = write("good.csv", tableToCsv(table));
    // A southern site starts with a minus sign, so it is written with "=".
    const { code, stdout, stderr } = fit(file, "--site=-33.9,18.4,20", "--date", "2026-02-01", "--units", "uT", "--model", "auto");
    expect(stderr).toBe("");
    expect(code).toBe(0);
    const document = JSON.parse(stdout);
    expect(document.verdict).toBe("pass");
    expect(document.magnetometers).toHaveLength(2);
    for (const mag of document.magnetometers) {
      expect(mag.offset).toHaveLength(3);
      expect(mag.softIron).toHaveLength(3);
      for (const row of mag.softIron) expect(row).toHaveLength(3);
      expect(typeof mag.fieldStrength).toBe("number");
      expect(typeof mag.residualRms).toBe("number");
      expect(["sphere", "axis", "full"]).toContain(mag.model);
      expect(Object.keys(mag.coverage)).toEqual(expect.arrayContaining(["fraction", "largestGapDeg", "gapCentre"]));
      expect(mag.coverage.gapCentre).toHaveLength(3);
    }
    expect(document.magnetometers[0].offset[0]).toBeCloseTo(truth.magnetometers[0].loggedHardIronOffset[0], 0);
    expect(document.accelerometer.offset).toHaveLength(3);
    expect(document.accelerometer.scale).toHaveLength(3);
    expect(document.accelerometer.poses).toHaveLength(6);
    expect(document.accelerometer.missingFaces).toEqual([]);
    expect(document.checks.length).toBeGreaterThan(10);
    for (const check of document.checks) {
      expect(Object.keys(check)).toEqual(
        expect.arrayContaining(["id", "status", "measured", "threshold", "unit", "explanation", "remedy", "source"]),
      );
    }
  }, 120_000);

  test("a capture without accelerometer columns has no accelerometer key; --map renames columns", () => {
    const { table } = simulateCapture({ seed: 5, accelerometer: false, gyro: false });
    const csv = tableToCsv(table).replace("compass_a.x,compass_a.y,compass_a.z", "A,B,C");
    const file = write("compass-only.csv", csv);
    const { code, stdout } = fit(file, "--map", "A=compass_a.x,B=compass_a.y,C=compass_a.z", "--units", "uT");
    expect(code).toBe(0);
    const document = JSON.parse(stdout);
    expect(document).not.toHaveProperty("accelerometer");
    expect(document.magnetometers).toHaveLength(1);
    expect(document).not.toHaveProperty("powersMotors");
  }, 120_000);

  test("a motor run (current and throttle columns) prints the full cautions on stderr and says powersMotors", () => {
    const reference = magneticReference(site, date);
    const { table } = simulateCapture({
      seed: 8,
      siteFieldNed: reference.fieldNedMicrotesla,
      holds: { faces: SIX },
      magnetometers: [{ hardIronOffset: [6, -2, 4], currentCoupling: [0.4, -0.2, 0.6] }],
      currentTest: { maxAmps: 30 },
    });
    expect(table.fields).toEqual(expect.arrayContaining(["current", "throttle"]));
    const file = write("motor-run.csv", tableToCsv(table).replace(",current,", ",Battery Current (A),"));
    const { code, stdout, stderr } = fit(file, "--site=-33.9,18.4,20", "--date", "2026-02-01", "--units", "uT");
    expect(code).toBe(0);
    // stdout stays one JSON document; the cautions are not in it.
    const document = JSON.parse(stdout);
    expect(document.powersMotors).toBe(true);
    expect(stderr).toMatch(/"Battery Current \(A\)" \(current\)/);
    for (const element of [
      /propellers off/,
      /vehicle restrained/,
      /battery handled as its maker says/,
      /people clear/,
      /local rules/i,
      /maker's manual/,
      /licensed practice/,
    ])
      expect(stderr).toMatch(element);
  }, 120_000);

  test.each([
    {
      label: "text in a number column",
      edit: (lines: string[]) => {
        lines[7] = lines[7].replace(/^([^,]*),[^,]*/, "$1,oops");
      },
      message: /row 8, column "compass_a.x"/,
    },
    {
      label: "time going backwards",
      edit: (lines: string[]) => {
        lines[20] = lines[20].replace(/^[^,]*/, "0");
      },
      message: /row 21, column "time".*backwards/,
    },
    {
      label: "a missing axis",
      edit: (lines: string[]) => {
        lines[0] = lines[0].replace("compass_a.z", "temperature");
      },
      message: /row 1, column "compass_a.z".*missing required column/,
    },
  ])(
    "a bad file ($label) exits with 2 and names row and column on stderr",
    ({ edit, message }) => {
      const { table } = simulateCapture({ seed: 5, pathSeconds: 10, accelerometer: false, gyro: false });
      const lines = tableToCsv(table).split("\n");
      edit(lines);
      const file = write("bad.csv", lines.join("\n"));
      const { code, stdout, stderr } = fit(file);
      expect(code).toBe(2);
      expect(stdout).toBe("");
      expect(stderr).toMatch(message);
    },
    120_000,
  );

  test.each([
    { label: "no file", args: [], message: /exactly one capture file/ },
    { label: "a file that does not exist", args: ["/nonexistent/capture.csv"], message: /cannot read the file/ },
    { label: "a malformed site", args: ["x.csv", "--site", "north"], message: /--site/ },
    { label: "an unknown unit", args: ["x.csv", "--units", "furlongs"], message: /--units/ },
    { label: "an unknown model", args: ["x.csv", "--model", "cubic"], message: /--model/ },
    { label: "a malformed map", args: ["x.csv", "--map", "a=b"], message: /--map/ },
  ])(
    "bad arguments ($label) exit with 2",
    ({ args, message }) => {
      const { code, stderr } = fit(...args);
      expect(code).toBe(2);
      expect(stderr).toMatch(message);
    },
    120_000,
  );
});

describe("npm run fit --mount", () => {
  test("declares a compass's mounting by id; an id that is none of the 48 is refused by name", () => {
    const reference = magneticReference(site, date);
    // The module sits a quarter turn about z (x-right.z-down) and logs its own axes.
    const { table } = simulateCapture({
      seed: 23,
      siteFieldNed: reference.fieldNedMicrotesla,
      accelerometer: false,
      gyro: false,
      magnetometers: [
        {},
        {
          mountingRotation: [
            [0, -1, 0],
            [1, 0, 0],
            [0, 0, 1],
          ],
          declaredRotation: [
            [1, 0, 0],
            [0, 1, 0],
            [0, 0, 1],
          ],
        },
      ],
    });
    const file = write("mounted.csv", tableToCsv(table));
    const good = fit(file, "--units", "uT", "--mount", "compass_b=x-right.z-down");
    expect(good.code).toBe(0);
    const document = JSON.parse(good.stdout);
    expect(document.magnetometers[1].declaredRotation.id).toBe("x-right.z-down");
    const check = document.checks.find((c: { id: string; sensor: string }) => c.id === "mag.mounting" && c.sensor === "compass_b");
    expect(check.status).toBe("pass");

    const bad = fit(file, "--units", "uT", "--mount", "compass_b=sideways");
    expect(bad.code).toBe(2);
    expect(bad.stderr).toContain('"sideways" is not one of the 48 mountings');
    expect(bad.stderr).toContain("--mount compass_b=x-right.z-down");
  }, 120_000);
});
