import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, test } from "vitest";
import { CheckList } from "@/components/run/check-list";
import { Comparison } from "@/components/run/comparison";
import { figuresOf } from "@/components/run/comparison-figures";
import { ParametersTable } from "@/components/run/parameters-table";
import { plotDataOf } from "@/components/run/plot-data";
import { Plots } from "@/components/run/plots";
import { SafetyCautions } from "@/components/run/safety-cautions";
import { MotorSafety } from "@/components/upload/motor-safety";
import { VerdictBanner } from "@/components/run/verdict-banner";
import { analyseCapture, type CaptureAnalysis } from "@/geometry/analyse-capture";
import { convertCapture } from "@/geometry/capture-units";
import { magneticReference } from "@/geometry/magnetic-reference";
import type { CaptureSpec } from "@/geometry/magnetometer-types";
import { mountingRotationById } from "@/geometry/mounting-rotations";
import { buildRunView, type RunView } from "@/geometry/run-view";
import { simulateCapture } from "@/geometry/simulator";

// Simulated captures (invented data) at an invented site; its field comes from WMM2025 (geomagnetism package).
const site = { latitudeDeg: 54.62, longitudeDeg: -2.91, altitudeM: 212 };
const date = new Date("2026-10-02T12:00:00Z");
const field = magneticReference(site, date).fieldNedMicrotesla;
const SIX = ["+z", "-z", "+x", "-x", "+y", "-y"] as const;

function run(spec: CaptureSpec, mountingRotations: Record<string, string> = {}): { analysis: CaptureAnalysis; view: RunView } {
  const { table } = simulateCapture({ siteFieldNed: field, ...spec });
  const units = { magnetic: { kind: "magnetic" as const, unit: "uT" as const } };
  const analysis = analyseCapture(table, { site, date, units, mountingRotations, bootstrap: false });
  // Through JSON, as the page gets it from the database and object storage.
  const plain = <T>(value: T): T => JSON.parse(JSON.stringify(value));
  return { analysis: plain(analysis), view: plain(buildRunView(convertCapture(table, analysis.units), analysis)) };
}

const html = (element: Parameters<typeof renderToStaticMarkup>[0]) => renderToStaticMarkup(element);

function panels(analysis: CaptureAnalysis, labels: Record<string, string> = {}) {
  return {
    banner: html(
      createElement(VerdictBanner, {
        verdict: analysis.verdict,
        verdictSummary: analysis.verdictSummary,
        diagnosis: analysis.diagnosis,
        checks: analysis.checks,
        sensorLabels: labels,
      }),
    ),
    checks: html(createElement(CheckList, { checks: analysis.checks, sensorLabels: labels })),
    parameters: html(
      createElement(ParametersTable, {
        magnetometers: analysis.magnetometers,
        accelerometers: analysis.accelerometers,
        gyroscopes: analysis.gyroscopes,
        expectedField: analysis.reference.magnetic,
        units: analysis.units,
        sensorLabels: labels,
      }),
    ),
  };
}

const rotated = run(
  {
    seed: 103,
    magnetometers: [
      { hardIronOffset: [5, -9, 12] },
      {
        mountingRotation: mountingRotationById("x-right.z-down")!.matrix,
        declaredRotation: mountingRotationById("x-forward.z-down")!.matrix,
      },
    ],
  },
  { compass_b: "x-forward.z-down" },
);
const motor = run({
  seed: 105,
  holds: { faces: ["+z"] },
  pathSeconds: 50,
  magnetometers: [{ hardIronOffset: [14, -6, 22], currentCoupling: [0.32, 0.12, -0.26] }],
  currentTest: { maxAmps: 38 },
});
const good = run({ seed: 101, holds: { faces: [...SIX] }, magnetometers: [{ hardIronOffset: [14, -6, 22], softIron: "mild" }] });
// Turned about one axis only, never held still: the compass fit is refused as planar and no accelerometer face was held.
const flat = run({ seed: 7, path: "yaw-only", pathSeconds: 30 });

describe("VerdictBanner", () => {
  test.each([
    ["a good capture", "pass", "Pass", good.analysis],
    ["a compass turned against its declaration", "fail", "Fail", rotated.analysis],
  ])("%s reads as %s", (_label, verdict, word, analysis) => {
    expect(analysis.verdict).toBe(verdict);
    const { banner } = panels(analysis);
    expect(banner).toContain(`data-verdict="${verdict}"`);
    expect(banner).toContain(`<span>${word}</span>`);
    expect(banner).toContain(analysis.verdictSummary.replace(/'/g, "&#x27;"));
  });
  test("lists the likely causes in the engine's ranking, each with why and what to do", () => {
    const { banner } = panels(rotated.analysis);
    const order = [...banner.matchAll(/data-cause="([^"]+)"/g)].map((m) => m[1]);
    expect(order).toEqual([...rotated.analysis.diagnosis].sort((a, b) => b.score - a.score).map((c) => c.id));
    expect(order[0]).toBe("mounting");
    for (const cause of rotated.analysis.diagnosis) expect(banner).toContain(cause.action.replace(/'/g, "&#x27;"));
  });
  test("every evidence link lands on a row of the check list", () => {
    const { banner, checks } = panels(rotated.analysis);
    const targets = [...banner.matchAll(/href="#([^"]+)"/g)].map((m) => m[1]);
    expect(targets.length).toBeGreaterThan(0);
    for (const target of targets) expect(checks).toContain(`id="${target}"`);
  });
});

describe("CheckList", () => {
  test("failures before warnings before passes, skipped checks folded under their reasons", () => {
    const { checks } = panels(motor.analysis);
    const rows = [...checks.matchAll(/<li id="[^"]+"[^>]*data-status="(\w+)"/g)].map((m) => m[1]);
    const rank = { fail: 0, warn: 1, pass: 2, skipped: 3 } as Record<string, number>;
    expect(rows.length).toBeGreaterThan(3);
    expect(rows.map((s) => rank[s])).toEqual([...rows.map((s) => rank[s])].sort((a, b) => a - b));
    const skipped = motor.analysis.checks.filter((c) => c.status === "skipped");
    if (skipped.length)
      expect(checks.slice(checks.indexOf("<details")).includes(skipped[0].explanation.replace(/'/g, "&#x27;"))).toBe(true);
  });
  test("keeps the motor cautions of a current-coupling remedy in view", () => {
    const coupling = motor.analysis.checks.find((c) => c.id === "mag.current")!;
    expect(coupling.status).toBe("fail");
    const { checks } = panels(motor.analysis);
    const box = checks.slice(checks.indexOf('data-testid="check-safety-remedy"'));
    expect(box).toMatch(/propellers off/);
    expect(checks.indexOf('data-testid="check-safety-remedy"')).toBeLessThan(
      checks.indexOf("<details") === -1 ? Infinity : checks.indexOf("<details"),
    );
  });
  test("every check gets a row or a folded line", () => {
    const { checks } = panels(good.analysis);
    const rendered = [...checks.matchAll(/data-check="([^"]+)"/g)].length;
    expect(rendered).toBe(good.analysis.checks.length);
  });
  test("measured values carry their units", () => {
    const { checks } = panels(rotated.analysis);
    const mounting = rotated.analysis.checks.find((c) => c.id === "mag.mounting" && c.sensor === "compass_b")!;
    expect(mounting.unit).toBe("° from declared");
    expect(checks).toMatch(/data-testid="check-measured">\s*(89\.\d|90\.0)° from declared/);
  });
});

describe("ParametersTable", () => {
  test("a second compass shows the measured rotation, the closest mounting in words with its Euler angles second, and the angle from the declaration", () => {
    const { parameters } = panels(rotated.analysis, { compass_b: "mast module" });
    const compass_b = parameters.slice(parameters.indexOf('data-sensor="compass_b"'));
    expect(compass_b).toContain("Compass B · mast module");
    // Hand computation: the module's x on the vehicle's right is a quarter turn about z, yaw +90°.
    expect(compass_b).toMatch(/closest mounting: <span[^>]*>module x → vehicle right, module z → down<\/span>/);
    const words = compass_b.indexOf("module x → vehicle right, module z → down");
    expect(compass_b.indexOf("Euler angles (roll, pitch, yaw): 0°, 0°, 90°")).toBeGreaterThan(words);
    expect(compass_b).toContain('Declared mounting</dt><dd class="mt-0.5 text-sm">module x → vehicle forward, module z → down');
    expect(compass_b).toMatch(/data-testid="mounting-picture"[^>]*data-mounting="x-right.z-down"/);
    expect(compass_b).toMatch(/data-testid="rotation-from-declared"[\s\S]*?(89\.\d|90\.0)°/);
  });
  test("a fitted compass shows offsets per axis, the soft-iron matrix and the model's field", () => {
    const { parameters } = panels(good.analysis);
    expect(parameters).toContain('data-testid="per-axis"');
    expect(parameters).toContain("Soft-iron matrix W");
    expect(parameters).toContain(`from ${good.analysis.reference.magnetic!.modelName}`);
    const offsetX = good.analysis.magnetometers[0].offset![0];
    expect(parameters).toContain(`${offsetX.toFixed(1)} µT`);
  });
  test("the accelerometer's holds, one row each", () => {
    const { parameters } = panels(good.analysis);
    const poses = parameters.slice(parameters.indexOf('data-testid="poses"'));
    const rows = poses.slice(0, poses.indexOf("</table>")).match(/<tr/g)!.length - 1;
    expect(rows).toBe(good.analysis.accelerometer!.poses.length);
  });
  test("missing faces are named and a refused compass fit gives its reason", () => {
    const compass = flat.analysis.magnetometers[0];
    const { parameters } = panels(flat.analysis);
    expect(flat.analysis.accelerometer!.missingFaces.length).toBeGreaterThan(0);
    expect(parameters).toContain('data-testid="missing-faces"');
    expect(parameters).toContain("Not held:");
    expect(compass.calibration.ok).toBe(false);
    if (!compass.calibration.ok) {
      expect(compass.calibration.reason).toBe("planar");
      expect(parameters).toContain('data-testid="fit-refused"');
      expect(parameters).toContain(compass.calibration.detail.replace(/'/g, "&#x27;"));
    }
  });
});

describe("Plots", () => {
  test("one figure per chart with data, each with a caption", () => {
    const markup = html(createElement(Plots, { data: plotDataOf(motor.view), gravityMps2: motor.analysis.reference.gravityMps2 }));
    const figures = markup.match(/<figure/g)!.length;
    // field strength + one residual histogram + one coupling plot + accelerometer magnitude
    expect(figures).toBe(4);
    expect(markup.match(/<figcaption/g)!.length).toBe(4);
    expect(markup).toContain('data-testid="plot-coupling"');
  });
  test("nothing for a view without data", () => {
    const empty = plotDataOf({
      ...good.view,
      magnetometers: [],
      coupling: [],
      series: { timeS: [], fieldStrength: {}, accelMagnitude: null, current: null, throttle: null },
    });
    expect(html(createElement(Plots, { data: empty }))).toBe("");
  });
});

describe("Comparison", () => {
  test("changes with sign, arrow and unit, and a link to the previous run", () => {
    const markup = html(
      createElement(Comparison, {
        current: figuresOf(rotated.analysis.magnetometers[0]),
        previous: figuresOf(good.analysis.magnetometers[0], { title: "Annual check", capturedOn: "2026-09-14" }),
        previousHref: "/w/demo/runs/previous",
      }),
    );
    expect(markup).toContain('href="/w/demo/runs/previous"');
    expect(markup).toContain("Annual check, 2026-09-14");
    // Offsets (5, −9, 12) against (14, −6, 22): x falls by about 9 µT.
    expect(markup).toMatch(/data-figure="offset-x" data-direction="down"/);
    expect(markup).toMatch(/−\d+\.\d µT/);
  });
  test("says so when there is no previous run", () => {
    const markup = html(
      createElement(Comparison, { current: figuresOf(good.analysis.magnetometers[0]), previous: null, previousHref: null }),
    );
    expect(markup).toContain("first run of this sensor");
  });
});

describe("SafetyCautions", () => {
  test.each([
    ["propeller"],
    ["tied or clamped down"],
    ["battery"],
    ["nobody is near"],
    ["Local aviation rules"],
    ["maker’s manual"],
    ["licensed practice"],
  ])("mentions %s", (words) => {
    expect(html(createElement(SafetyCautions))).toContain(words);
  });
  test.each([
    ["multirotor", "Local aviation rules"],
    ["fixed-wing", "Local aviation rules"],
    ["vtol", "Local aviation rules"],
    ["other", "Local aviation rules"],
    ["rover", "Local rules,"],
    ["boat", "Local rules,"],
  ] as const)("a %s's cautions defer to %s first", (vehicleKind, words) => {
    const markup = html(createElement(SafetyCautions, { vehicleKind }));
    expect(markup).toContain(words);
    expect(markup).toContain("maker’s manual and licensed practice");
    if (vehicleKind === "rover" || vehicleKind === "boat") expect(markup).not.toContain("aviation");
  });
});

describe("MotorSafety (upload page)", () => {
  const box = (vehicleKind: "multirotor" | "boat" | null) =>
    html(
      createElement(MotorSafety, {
        vehicleKind,
        powersMotors: true,
        fromColumns: true,
        acknowledged: false,
        onPowersMotors: () => undefined,
        onAcknowledged: () => undefined,
      }),
    );
  test.each([
    ["multirotor", "Local aviation rules"],
    [null, "Local aviation rules"],
    ["boat", "Local rules,"],
  ] as const)("for a %s, names %s, with all the cautions", (vehicleKind, words) => {
    const markup = box(vehicleKind);
    expect(markup).toContain(words);
    for (const caution of ["propellers off", "restrained", "battery", "clear of the motors", "maker’s manual", "licensed practice"])
      expect(markup).toContain(caution);
  });
});
