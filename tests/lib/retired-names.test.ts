/**
 * Loxodrome names sensors, mountings and checks in its own words. This walks every source a
 * person reads — pages, components, the engine's wording, exports, the command line's help and
 * output, API error messages, seed data, the README — for the retired spellings and fails on
 * any: zero-based slot stems ("mag0", "accel1", "magN"), mountings named as lists of turns
 * ("yaw 90", "roll 180 yaw 45") or called "standard", "bias stability", and the demo vehicle
 * names that belonged to real aircraft.
 *
 * Only `lib/legacy-names.ts` and the migration that uses it may know the retired spellings
 * (they read old data); uploaded files' own column names (`mag_x`, `mag2_x`) are read, never
 * printed back as ours, and are not slot names, so they do not match.
 */
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { describe, expect, test } from "vitest";
import { analyseCapture } from "@/geometry/analyse-capture";
import { magneticReference } from "@/geometry/magnetic-reference";
import { mountingRotationById } from "@/geometry/mounting-rotations";
import { simulateCapture, tableToCsv } from "@/geometry/simulator";
import { toJsonSafe } from "@/lib/jobs/results-json";
import { correctionCsv, correctionDocument, correctionHeader } from "@/lib/export/correction";
import { DEMO_SCENARIOS } from "@/lib/seed/demo-scenarios";
import { DEMO_PEOPLE, DEMO_WORKSPACES } from "@/lib/seed/demo-people";

const root = path.resolve(__dirname, "../..");

/** Each retired spelling, with what it was. */
const RETIRED: { label: string; pattern: RegExp }[] = [
  { label: "zero-based slot stem (mag0, accel1, gyro2)", pattern: /\b(?:mag|accel|gyro)\d\b/ },
  { label: "numbered slot placeholder (magN, accelN)", pattern: /\b(?:mag|accel|gyro)N\b/ },
  { label: "C name with a numbered slot", pattern: /lox_(?:mag|accel|gyro)\d/ },
  { label: "mounting named as turns (yaw 90, roll 180 yaw 45)", pattern: /\b(?:roll|pitch|yaw) (?:45|90|135|180|225|270|315)\b(?!\s*°)/ },
  { label: '"standard" mountings or rotations', pattern: /\bstandard (?:mounting|rotation|one|name|set)|nearest standard|standard:/i },
  { label: '"bias stability" for a between-holds change', pattern: /bias stability/i },
  { label: "demo vehicle named after a real aircraft", pattern: /\b(?:Heron|Skylark)\b/ },
  { label: "retired demo vehicle name", pattern: /\b(?:Marsh rover|Kelp)\b/ },
];

/** Files that read old data and therefore must know the old spellings. */
const KNOWS_RETIRED = new Set([
  "lib/legacy-names.ts",
  "migrations/20261203-0005-own-names.ts",
  "tests/lib/retired-names.test.ts",
  "tests/lib/legacy-names.test.ts",
  "tests/browser/legacy-names.test.ts",
]);

function walk(dir: string, out: string[] = []): string[] {
  for (const entry of fs.readdirSync(path.join(root, dir), { withFileTypes: true })) {
    const relative = path.join(dir, entry.name);
    if (entry.isDirectory()) {
      if (entry.name === "node_modules" || entry.name.startsWith(".next") || entry.name === "fixtures") continue;
      walk(relative, out);
    } else if (/\.(tsx?|mjs|md|json|css)$/.test(entry.name)) out.push(relative);
  }
  return out;
}

function findRetired(text: string): string[] {
  const found: string[] = [];
  text.split("\n").forEach((line, index) => {
    for (const { label, pattern } of RETIRED) {
      const match = pattern.exec(line);
      if (match) found.push(`line ${index + 1}: "${match[0]}" (${label})`);
    }
  });
  return found;
}

describe("the retired spellings are gone from what people read", () => {
  const sources = [
    ...["app", "components", "lib", "geometry", "scripts", "bench", "models", "public", "tests"].flatMap((dir) => walk(dir)),
    "README.md",
    "DEVELOPERS.md",
  ].filter((file) => !KNOWS_RETIRED.has(file));

  test("there are sources to walk", () => {
    expect(sources.length).toBeGreaterThan(200);
    expect(sources).toContain("components/run/verdict-banner.tsx");
  });

  test.each(sources.map((file) => [file]))("%s", (file) => {
    const text = fs.readFileSync(path.join(root, file), "utf8");
    // Tests may feed the retired column spellings to the reader as a file's own headers,
    // but never expect them back: only the demo names are checked there.
    const found = file.startsWith("tests/") ? findRetired(text).filter((hit) => /demo vehicle/.test(hit)) : findRetired(text);
    expect(found).toEqual([]);
  });

  test("the checker itself catches each retired spelling", () => {
    const samples = [
      "Compass mag0 · board",
      "magN.x",
      "lox_mag1_offset",
      "roll 180 yaw 45",
      "nearest standard",
      "Gyroscope bias stability",
      "Heron 1",
    ];
    for (const sample of samples) expect(findRetired(sample), sample).not.toEqual([]);
    expect(findRetired("Compass A · board, compass_b.x, mag_x, mag2_x, yaw 90°, lox_compass_a_offset")).toEqual([]);
  });
});

describe("the retired spellings are gone from what the product writes", () => {
  const site = { latitudeDeg: 51.2, longitudeDeg: -2.1, altitudeM: 60 };
  const date = new Date("2026-11-20T12:00:00Z");
  const reference = magneticReference(site, date);
  const turned = mountingRotationById("x-right.z-down")!;
  const identity = mountingRotationById("x-forward.z-down")!;
  const capture = simulateCapture({
    seed: 77,
    siteFieldNed: reference.fieldNedMicrotesla,
    holds: { faces: ["+z", "-z", "+x", "-x", "+y", "-y"] },
    magnetometers: [
      { hardIronOffset: [6, -4, 9], currentCoupling: [0.8, 0.2, 1.4] },
      { hardIronOffset: [-2, 3, 1], mountingRotation: turned.matrix, declaredRotation: identity.matrix },
    ],
    currentTest: { maxAmps: 25 },
  });
  const analysis = analyseCapture(capture.table, {
    site,
    date,
    units: {},
    mountingRotations: { compass_a: identity.id, compass_b: identity.id },
    seed: 1,
  });
  const results = toJsonSafe(analysis) as Record<string, unknown>;

  test("the engine's checks, diagnosis and notes (two compasses, one turned, a motor run)", () => {
    expect(analysis.checks.length).toBeGreaterThan(10);
    expect(findRetired(JSON.stringify(results, null, 1))).toEqual([]);
  });

  test("the correction exports (JSON, CSV, C header)", () => {
    const doc = correctionDocument(results, {
      runId: "run-1",
      vehicleName: "Test vehicle",
      capturedOn: "2026-11-20",
      versionNumber: 1,
      siteName: "Test field",
      verdict: analysis.verdict,
      signedOff: null,
      sensorLabels: { compass_a: "board", compass_b: "mast module", accel_a: "board IMU" },
    });
    for (const text of [JSON.stringify(doc, null, 1), correctionCsv(doc), correctionHeader(doc)]) expect(findRetired(text)).toEqual([]);
    expect(correctionHeader(doc)).toContain("lox_compass_a_offset");
  });

  test("the demo workspaces, people and teaching scenarios", () => {
    expect(findRetired(JSON.stringify({ DEMO_WORKSPACES, DEMO_PEOPLE, DEMO_SCENARIOS }, null, 1))).toEqual([]);
  });

  test("the command line's help and output", () => {
    const folder = fs.mkdtempSync(path.join(os.tmpdir(), "loxodrome-words-"));
    const file = path.join(folder, "capture.csv");
    fs.writeFileSync(file, tableToCsv(capture.table));
    const run = (...args: string[]) =>
      spawnSync(process.execPath, ["--import", "tsx", path.join(root, "scripts/fit.ts"), ...args], {
        cwd: root,
        encoding: "utf8",
        timeout: 120_000,
      });
    const help = run();
    const output = run(file, "--site=51.2,-2.1,60", "--date", "2026-11-20", "--units", "uT", "--mount", "compass_b=x-forward.z-down");
    const badMount = run(file, "--mount", "compass_b=sideways");
    fs.rmSync(folder, { recursive: true, force: true });
    expect(output.status).toBe(0);
    expect(JSON.parse(output.stdout).magnetometers).toHaveLength(2);
    for (const text of [help.stdout, help.stderr, output.stdout, output.stderr, badMount.stderr]) expect(findRetired(text)).toEqual([]);
  }, 120_000);
});
