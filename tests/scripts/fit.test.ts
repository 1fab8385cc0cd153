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

/** Runs the CLI as `npm run fit` does: plain node on the launcher, which runs the compiled bundle. */
function fit(...args: string[]) {
  const result = spawnSync(process.execPath, [path.join(root, "scripts/fit.mjs"), ...args], {
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
    // A southern site starts with a minus sign and is typed as written.
    const { code, stdout, stderr } = fit(file, "--site", "-33.9,18.4,20", "--date", "2026-02-01", "--units", "uT", "--model", "auto");
    expect(stderr).toBe("");
    expect(code).toBe(0);
    const document = JSON.parse(stdout);
    expect(document.verdict).toBe("pass");
    expect(document.site).toEqual(site);
    // The capture date stands for noon UTC of that day, as in the worker.
    expect(document.date).toBe("2026-02-01T12:00:00.000Z");
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

describe("npm run fit: sites south and west of zero", () => {
  const { table } = simulateCapture({ seed: 5, pathSeconds: 20, accelerometer: false, gyro: false });
  // Where the field model is evaluated is printed back as `site`; each form must give the same numbers.
  test.each([
    { label: "south, after a space", args: ["--site", "-33.9,151.2,0"], site: { latitudeDeg: -33.9, longitudeDeg: 151.2, altitudeM: 0 } },
    { label: "south, after =", args: ["--site=-33.9,151.2,0"], site: { latitudeDeg: -33.9, longitudeDeg: 151.2, altitudeM: 0 } },
    { label: "west, after a space", args: ["--site", "40.4,-3.7,650"], site: { latitudeDeg: 40.4, longitudeDeg: -3.7, altitudeM: 650 } },
    {
      label: "south-west, after a space",
      args: ["--site", "-12.05,-77.04,150"],
      site: { latitudeDeg: -12.05, longitudeDeg: -77.04, altitudeM: 150 },
    },
    { label: "south-west, after =", args: ["--site=-12.05,-77.04"], site: { latitudeDeg: -12.05, longitudeDeg: -77.04, altitudeM: 0 } },
    { label: "a decimal without its zero", args: ["--site", "-.5,-0.5,1"], site: { latitudeDeg: -0.5, longitudeDeg: -0.5, altitudeM: 1 } },
  ])(
    "$label",
    ({ args, site: expected }) => {
      const file = write("hemispheres.csv", tableToCsv(table));
      const { code, stdout, stderr } = fit(file, ...args, "--date", "2026-03-01", "--units", "uT");
      expect(stderr).toBe("");
      expect(code).toBe(0);
      const document = JSON.parse(stdout);
      expect(document.site).toEqual(expected);
      expect(document.reference.magnetic).not.toBeNull();
    },
    120_000,
  );

  test("a latitude beyond the south pole is refused by name", () => {
    const { code, stderr } = fit("x.csv", "--site", "-95,10");
    expect(code).toBe(2);
    expect(stderr).toMatch(/--site latitude -95 is outside/);
  });
});

describe("npm run fit: units written in the column names", () => {
  // Column names in the dialects of logger exports (common practice): camelCase axis letters, a unit after an underscore or in brackets.
  const { table } = simulateCapture({ seed: 9, pathSeconds: 20, holds: { faces: SIX }, gyro: false });
  const renamed = (csv: string) => {
    const lines = csv.split("\n");
    const header = lines[0].split(",");
    const names: Record<string, string> = {
      time: "time_ms",
      "compass_a.x": "compassX_nT",
      "compass_a.y": "MagY_nT",
      "compass_a.z": "magZ[nT]",
      "accel_a.x": "accX_g",
      "accel_a.y": "AccelY[g]",
      "accel_a.z": "accZ_g",
    };
    const scale: Record<string, number> = { time: 1000, "compass_a.x": 1000, "compass_a.y": 1000, "compass_a.z": 1000 };
    for (const name of ["accel_a.x", "accel_a.y", "accel_a.z"]) scale[name] = 1 / 9.80665;
    const out = [header.map((h) => names[h] ?? h).join(",")];
    for (const line of lines.slice(1)) {
      if (!line) continue;
      out.push(
        line
          .split(",")
          .map((cell, i) => String(Number(cell) * (scale[header[i]] ?? 1)))
          .join(","),
      );
    }
    return `${out.join("\n")}\n`;
  };

  test("without --units the units come from the header; --units still wins", () => {
    const file = write("dialect.csv", renamed(tableToCsv(table)));
    const fromHeader = fit(file);
    expect(fromHeader.code).toBe(0);
    const document = JSON.parse(fromHeader.stdout);
    expect(document.units.compass_a).toMatchObject({ spec: { unit: "nT" }, how: "column name" });
    expect(document.units.accel_a).toMatchObject({ spec: { unit: "g" }, how: "column name" });
    expect(document.units.time).toMatchObject({ spec: { unit: "ms" }, how: "column name" });
    // Read in nT, the field is the simulated one in µT.
    const plain = JSON.parse(fit(write("plain.csv", tableToCsv(table)), "--units", "uT").stdout);
    expect(document.magnetometers[0].fieldStrength).toBeCloseTo(plain.magnetometers[0].fieldStrength, 3);

    const stated = JSON.parse(fit(file, "--units", "uT").stdout);
    expect(stated.units.compass_a).toMatchObject({ spec: { unit: "uT" }, how: "stated" });
  }, 120_000);

  test("a file whose headers name no sensor gets the message naming them", () => {
    const file = write("unknown.csv", `time,temperature_degC,pressure [hPa]\n${"1,20,1000\n".repeat(60)}`);
    const { code, stderr } = fit(file);
    expect(code).toBe(2);
    expect(stderr).toContain('"temperature_degC", "pressure [hPa]"');
    expect(stderr).toMatch(/row 1: missing required columns/);
  });
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
