import { describe, expect, test } from "vitest";
import { PRESCREEN_MAX_FRACTION, clearRuns, describeRuns, findRejectedRuns, prescreenFarSamples } from "@/geometry/burst-rejection";
import { REJECTED_STRETCH_ADVICE, rejectedStretchSentence, rejectedStretchWords } from "@/geometry/burst-words";
import { calibrateMagnetometer } from "@/geometry/calibrate-magnetometer";
import { createRandom } from "@/geometry/random";
import { simulateCapture } from "@/geometry/simulator";
import type { Vec3Series } from "@/geometry/types";
import { identity3 } from "@/geometry/vector";

/** Invented data: n directions spread over the sphere (or a cap of `capDeg`), on an ellipsoid of semi-axes `axes` about `centre`. */
function ellipsoidCloud(
  n: number,
  options: { axes?: number[]; centre?: number[]; noise?: number; capDeg?: number; seed?: number } = {},
): Vec3Series {
  const { axes = [50, 50, 50], centre = [0, 0, 0], noise = 0.3, capDeg = 180, seed = 1 } = options;
  const r = createRandom(seed);
  const field: Vec3Series = { x: new Float64Array(n), y: new Float64Array(n), z: new Float64Array(n) };
  for (let i = 0; i < n; i++) {
    const c = r.between(Math.cos((capDeg * Math.PI) / 180), 1);
    const phi = r.between(0, 2 * Math.PI);
    const s = Math.sqrt(1 - c * c);
    field.x[i] = centre[0] + axes[0] * c + r.gaussian(0, noise);
    field.y[i] = centre[1] + axes[1] * s * Math.cos(phi) + r.gaussian(0, noise);
    field.z[i] = centre[2] + axes[2] * s * Math.sin(phi) + r.gaussian(0, noise);
  }
  return field;
}

/** Overwrite samples from..to with one far value (a stuck reading). */
function stick(field: Vec3Series, from: number, to: number, value: [number, number, number]) {
  field.x.fill(value[0], from, to);
  field.y.fill(value[1], from, to);
  field.z.fill(value[2], from, to);
}

const all = (n: number) => new Uint8Array(n).fill(1);

describe("findRejectedRuns", () => {
  // By hand: rejected at 2 (alone), 10–16 with 13 kept (one gap), 30–33 (four: too few), 40–44 and 48–52 (a gap of three kept).
  const eligible = all(60);
  const kept = all(60);
  for (const i of [2, 10, 11, 12, 14, 15, 16, 30, 31, 32, 33, 40, 41, 42, 43, 44, 48, 49, 50, 51, 52]) kept[i] = 0;

  test("groups consecutive rejections, merges short gaps and drops short runs", () => {
    expect(findRejectedRuns(eligible, kept)).toEqual([
      { startIndex: 10, endIndex: 17, samples: 6 },
      { startIndex: 40, endIndex: 53, samples: 10 },
    ]);
  });

  test("a narrower merge gap splits the runs; fewer samples needed keeps short ones", () => {
    expect(findRejectedRuns(eligible, kept, { mergeGap: 2 }).map((r) => r.startIndex)).toEqual([10, 40, 48]);
    expect(findRejectedRuns(eligible, kept, { minSamples: 4 }).map((r) => r.startIndex)).toEqual([10, 30, 40]);
  });

  test("samples that were never eligible are not rejections", () => {
    const notEligible = all(60);
    notEligible.fill(0, 10, 17);
    expect(findRejectedRuns(notEligible, kept).map((r) => r.startIndex)).toEqual([40]);
  });

  test("clearRuns leaves out each run whole, gaps included", () => {
    const cleared = clearRuns(Uint8Array.from(kept), findRejectedRuns(eligible, kept));
    expect(cleared[13]).toBe(0);
    expect(Array.from(cleared.subarray(45, 48))).toEqual([0, 0, 0]);
    expect(cleared[2]).toBe(0);
    expect(cleared[20]).toBe(1);
  });
});

describe("prescreenFarSamples", () => {
  test("keeps every sample of a clean ellipsoid with axis ratio 1.5 (strong soft iron)", () => {
    const field = ellipsoidCloud(5000, { axes: [61, 50, 41], centre: [40, -20, 30] });
    const screen = prescreenFarSamples(field, all(5000));
    expect(screen.applied).toBe(true);
    expect(screen.rejected).toBe(0);
  });

  test("leaves out a stuck stretch far off the sphere, and only that, with the centre found despite it", () => {
    const field = ellipsoidCloud(5000, { centre: [40, -20, 30] });
    stick(field, 2000, 2150, [400, 100, -150]);
    const screen = prescreenFarSamples(field, all(5000));
    expect(screen.rejected).toBe(150);
    for (let i = 2000; i < 2150; i++) expect(screen.kept[i]).toBe(0);
    // Centre within 1 µT of the invented one (noise 0.3 µT over 4,850 samples fixes it far better).
    [40, -20, 30].forEach((c, k) => expect(Math.abs(screen.centre![k] - c)).toBeLessThan(1));
  });

  test(`is not applied when it would leave out more than ${PRESCREEN_MAX_FRACTION * 100}% of the samples`, () => {
    // Invented: two shells, the second twice the radius and holding 40% of the samples.
    const inner = ellipsoidCloud(3000, { seed: 2 });
    const outer = ellipsoidCloud(2000, { axes: [100, 100, 100], seed: 3 });
    const field: Vec3Series = {
      x: Float64Array.of(...inner.x, ...outer.x),
      y: Float64Array.of(...inner.y, ...outer.y),
      z: Float64Array.of(...inner.z, ...outer.z),
    };
    const screen = prescreenFarSamples(field, all(5000));
    expect(screen.applied).toBe(false);
    expect(screen.rejected).toBe(0);
    expect(screen.kept.every((v) => v === 1)).toBe(true);
  });
});

describe("describeRuns", () => {
  test("times and field multiple of a stretch, by hand", () => {
    const field = ellipsoidCloud(1000);
    stick(field, 500, 560, [0, 150, 0]);
    const time = Float64Array.from({ length: 1000 }, (_, i) => 3 + i / 50);
    const correction = { hardIronOffset: [0, 0, 0] as [number, number, number], softIronMatrix: identity3(), fieldStrength: 50 };
    const [stretch] = describeRuns(field, [{ startIndex: 500, endIndex: 560, samples: 60 }], correction, time);
    // Sample 500 at 3 + 500/50 = 13 s; 60 samples at 50 Hz last 1.2 s; |(0, 150, 0)| / 50 = 3.
    expect(stretch.startS).toBeCloseTo(13, 12);
    expect(stretch.durationS).toBeCloseTo(1.2, 12);
    expect(stretch.fieldMultiple).toBeCloseTo(3, 12);
    const untimed = describeRuns(field, [{ startIndex: 500, endIndex: 560, samples: 60 }], correction);
    expect(untimed[0].startS).toBeNull();
    expect(untimed[0].durationS).toBeNull();
  });
});

describe("rejected-stretch words", () => {
  const stretch = { startIndex: 2500, endIndex: 2560, samples: 60, startS: 50, durationS: 1.2, fieldMultiple: 4.83 };

  test("name the stretch in seconds, or in data rows without time", () => {
    expect(rejectedStretchSentence(stretch)).toBe("1.2 s of readings at 4.8× the field from 50.0 s were left out.");
    expect(rejectedStretchSentence({ ...stretch, startS: null, durationS: null })).toBe(
      "60 consecutive readings at 4.8× the field from data row 2501 were left out.",
    );
  });

  test("say what to do, once, each sentence with one final full stop", () => {
    const words = rejectedStretchWords([stretch, { ...stretch, startS: 70.04 }]);
    expect(words.split(REJECTED_STRETCH_ADVICE)).toHaveLength(2);
    expect(words).toMatch(/connector/);
    expect(words).toMatch(/magnet/);
    expect(words).not.toMatch(/\.\./);
    expect(words.endsWith(".")).toBe(true);
    expect(rejectedStretchWords([])).toBe("");
  });
});

describe("refusals survive a burst", () => {
  test("a 30° cap with a stuck stretch is still refused as a small cap", () => {
    const field = ellipsoidCloud(1500, { capDeg: 30, seed: 12 });
    stick(field, 700, 730, [-300, 200, 100]);
    const result = calibrateMagnetometer(field);
    expect(result.ok === false && result.reason).toBe("small-cap");
  });

  test("a yaw-only turn with a magnet carried past is still refused as a ring", () => {
    const { table } = simulateCapture({
      seed: 4,
      path: "yaw-only",
      pathSeconds: 40,
      accelerometer: false,
      gyro: false,
      magnetometers: [{ hardIronOffset: [10, 10, 10], glitchBursts: [{ kind: "magnet", startS: 20, durationS: 1 }] }],
    });
    const field: Vec3Series = { x: table.columns["compass_a.x"], y: table.columns["compass_a.y"], z: table.columns["compass_a.z"] };
    const result = calibrateMagnetometer(field, { time: table.columns.time });
    expect(result.ok === false && result.reason).toBe("planar");
  });
});
