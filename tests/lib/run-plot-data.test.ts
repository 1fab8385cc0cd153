import { describe, expect, test } from "vitest";
import {
  fractionInBand,
  hasPlots,
  histogramBars,
  histogramSpread,
  interceptWithSlope,
  niceScale,
  plotDataOf,
  scatterPoints,
  slopeSegment,
  timeAxis,
  timeRows,
  unlabelledStillPeriods,
  type PlotData,
} from "@/components/run/plot-data";
import type { RunView } from "@/geometry/run-view";

// Every value below is small enough to check by hand.

describe("timeRows", () => {
  test("one row per instant, a column per sensor, missing values as null", () => {
    expect(timeRows([0, 0.5], { compass_a: [50, 51], compass_b: [49] })).toEqual([
      { timeS: 0, compass_a: 50, compass_b: 49 },
      { timeS: 0.5, compass_a: 51, compass_b: null },
    ]);
  });
});

describe("fractionInBand", () => {
  test.each([
    ["all inside", [45, 50, 54], 1],
    ["edges count as inside", [44.9, 54.9], 1],
    ["half outside", [40, 50, 60, 50], 0.5],
    ["non-finite values ignored", [50, null, Number.NaN, 70], 0.5],
  ])("%s", (_label, values, share) => {
    expect(fractionInBand(values, 44.9, 54.9)).toBeCloseTo(share, 12);
  });
  test("null without values", () => {
    expect(fractionInBand([null], 0, 1)).toBeNull();
  });
});

describe("histogramBars", () => {
  test("bar centres halfway between edges", () => {
    expect(histogramBars([-1, 0, 2], [3, 4])).toEqual([
      { centre: -0.5, low: -1, high: 0, count: 3 },
      { centre: 1, low: 0, high: 2, count: 4 },
    ]);
  });
});

describe("histogramSpread", () => {
  const edges = [-3, -2, -1, 0, 1, 2, 3];
  test.each([
    // total 100; peak bin [0,1] holds 40; adding [-1,0] (30) reaches 70, then [1,2] (15) reaches 85, then [-2,-1] (10) reaches 95.
    ["90% of a lopsided bell", [2, 10, 30, 40, 15, 3], 0.9, { total: 100, peak: 0.5, low: -2, high: 2 }],
    ["a share the peak already holds", [2, 10, 30, 40, 15, 3], 0.4, { total: 100, peak: 0.5, low: 0, high: 1 }],
    ["everything in one bin", [0, 0, 0, 7, 0, 0], 0.9, { total: 7, peak: 0.5, low: 0, high: 1 }],
  ])("%s", (_label, counts, share, spread) => {
    expect(histogramSpread(edges, counts, share)).toEqual(spread);
  });
  test("null for an empty histogram or edges that do not fit the counts", () => {
    expect(histogramSpread(edges, [0, 0, 0, 0, 0, 0])).toBeNull();
    expect(histogramSpread([0, 1], [1, 2])).toBeNull();
  });
});

describe("slopeSegment", () => {
  test.each([
    [
      "from zero to the largest input",
      0.3,
      [5, 38, 20],
      [
        { x: 0, y: 0 },
        { x: 38, y: 0.3 * 38 },
      ],
    ],
    [
      "negative slope",
      -0.26,
      [10, 20],
      [
        { x: 0, y: 0 },
        { x: 20, y: -0.26 * 20 },
      ],
    ],
    [
      "inputs below zero widen the line",
      2,
      [-1, 1],
      [
        { x: -1, y: -2 },
        { x: 1, y: 2 },
      ],
    ],
  ])("%s", (_label, slope, inputs, segment) => {
    expect(slopeSegment(slope, inputs)).toEqual(segment);
  });
  test.each([
    ["no inputs", 1, []],
    ["only zero input", 1, [0, 0]],
    ["a slope that is not a number", Number.NaN, [1, 2]],
  ])("null for %s", (_label, slope, inputs) => {
    expect(slopeSegment(slope, inputs)).toBeNull();
  });
});

describe("interceptWithSlope", () => {
  test("recovers the offset of points on a line of the given slope", () => {
    const inputs = [1, 2, 3, 4];
    const changes = inputs.map((x) => 12 + 0.5 * x);
    expect(interceptWithSlope(inputs, changes, 0.5)).toBeCloseTo(12, 12);
  });
  test("is the mean of change − slope·input for scattered points", () => {
    // (1 − 0) + (3 − 2) + (2 − 4) = 0 → mean 0.
    expect(interceptWithSlope([0, 1, 2], [1, 3, 2], 2)).toBeCloseTo(0, 12);
  });
  test("null without usable points", () => {
    expect(interceptWithSlope([], [], 1)).toBeNull();
    expect(interceptWithSlope([Number.NaN], [1], 1)).toBeNull();
  });
});

describe("scatterPoints", () => {
  test("pairs inputs with changes, skipping non-finite ones", () => {
    expect(scatterPoints([1, 2, 3], [0.1, Number.NaN, 0.3])).toEqual([
      { x: 1, y: 0.1 },
      { x: 3, y: 0.3 },
    ]);
  });
});

describe("niceScale", () => {
  test.each([
    ["field strength band", 44.9, 54.9, 5, { domain: [44, 56], ticks: [44, 46, 48, 50, 52, 54, 56], decimals: 0 }],
    ["residuals around zero", -0.52, 0.55, 6, { domain: [-0.6, 0.6], ticks: [-0.6, -0.4, -0.2, 0, 0.2, 0.4, 0.6], decimals: 1 }],
    ["steps of 2.5 need a decimal", 0, 10, 4, { domain: [0, 10], ticks: [0, 2.5, 5, 7.5, 10], decimals: 1 }],
    ["steps of 25", 0, 81, 4, { domain: [0, 100], ticks: [0, 25, 50, 75, 100], decimals: 0 }],
  ])("%s", (_label, low, high, target, scale) => {
    expect(niceScale(low, high, target)).toEqual(scale);
  });
  test("widens a flat range instead of dividing by zero", () => {
    const scale = niceScale(9.81, 9.81);
    expect(scale.domain[0]).toBeLessThan(9.81);
    expect(scale.domain[1]).toBeGreaterThan(9.81);
  });
});

describe("timeAxis", () => {
  test("spans the capture exactly with ticks inside it", () => {
    expect(timeAxis([0, 40, 81])).toEqual({ domain: [0, 81], ticks: [0, 20, 40, 60, 80], decimals: 0 });
  });
});

describe("unlabelledStillPeriods", () => {
  test("keeps only still periods that overlap no pose", () => {
    const still = [
      { startS: 0, endS: 4 },
      { startS: 10, endS: 12 },
      { startS: 20, endS: 30 },
    ];
    expect(
      unlabelledStillPeriods(still, [
        { startS: 1, endS: 3 },
        { startS: 25, endS: 40 },
      ]),
    ).toEqual([{ startS: 10, endS: 12 }]);
  });
});

function view(overrides: Partial<RunView> = {}): RunView {
  return {
    sampleCount: 0,
    pointsShown: 0,
    magnetometers: [],
    pairedDirections: null,
    series: { timeS: [], fieldStrength: {}, accelMagnitude: null, current: null, throttle: null },
    stillPeriods: [],
    poses: [],
    expectedField: null,
    coupling: [],
    ...overrides,
  };
}

describe("plotDataOf", () => {
  test("drops the point clouds and keeps each compass's residual histogram", () => {
    const data = plotDataOf(
      view({
        magnetometers: [
          {
            sensor: "compass_a",
            raw: [1, 2, 3],
            corrected: [1, 2, 3],
            hardIronOffset: null,
            softIronMatrix: null,
            fieldStrength: null,
            cellCounts: null,
            gridResolution: null,
            minSamplesPerCell: null,
            largestGapDeg: null,
            gapCentre: null,
            nextOrientation: null,
            residualHistogram: { edges: [0, 1], counts: [5] },
          },
          {
            sensor: "compass_b",
            raw: [],
            corrected: null,
            hardIronOffset: null,
            softIronMatrix: null,
            fieldStrength: null,
            cellCounts: null,
            gridResolution: null,
            minSamplesPerCell: null,
            largestGapDeg: null,
            gapCentre: null,
            nextOrientation: null,
            residualHistogram: null,
          },
        ],
      }),
    );
    expect(data.residualHistograms).toEqual([{ sensor: "compass_a", edges: [0, 1], counts: [5] }]);
    expect(JSON.stringify(data)).not.toContain("raw");
  });
});

describe("hasPlots", () => {
  const empty: PlotData = plotDataOf(view());
  test.each([
    ["nothing at all", empty, false],
    ["time without any field strength", { ...empty, series: { ...empty.series, timeS: [0, 1], fieldStrength: { compass_a: [] } } }, false],
    ["a field strength line", { ...empty, series: { ...empty.series, timeS: [0], fieldStrength: { compass_a: [50] } } }, true],
    ["an empty histogram", { ...empty, residualHistograms: [{ sensor: "compass_a", edges: [0, 1], counts: [0] }] }, false],
    ["an accelerometer line", { ...empty, series: { ...empty.series, accelMagnitude: [9.8] } }, true],
  ])("%s", (_label, data, expected) => {
    expect(hasPlots(data as PlotData)).toBe(expected);
  });
});
