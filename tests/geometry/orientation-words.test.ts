import { describe, expect, test } from "vitest";
import { coverageCheck, gapCheck } from "@/geometry/checks-magnetometer";
import type { CoverageResult } from "@/geometry/magnetometer-types";
import { GAP_WORTH_FILLING_DEG, bodyDirectionWords, describeNextOrientation, suggestAttitude } from "@/geometry/orientation-words";
import { fromYawPitchRoll } from "@/geometry/rotation";
import { cellCentre, cellCount } from "@/geometry/sphere-cells";
import { resolveThresholds } from "@/geometry/thresholds";
import type { Vec3 } from "@/geometry/types";
import { DEG, angleBetweenDeg, mulMatVec } from "@/geometry/vector";

describe("bodyDirectionWords", () => {
  test.each([
    // Body frame x forward, y right, z down (PRODUCT.md).
    { label: "+x", v: [1, 0, 0], words: "the nose" },
    { label: "−x", v: [-1, 0, 0], words: "the tail" },
    { label: "+y", v: [0, 1, 0], words: "the right side" },
    { label: "−z", v: [0, 0, -1], words: "the top" },
    { label: "+z", v: [0, 0, 1], words: "the underside" },
    { label: "between top and left side", v: [0, -0.7, -0.7], words: /the (top and left side|left side and top)/ },
    { label: "mostly nose, a little right", v: [0.95, 0.2, 0], words: "the nose" },
  ])("$label", ({ v, words }) => {
    expect(bodyDirectionWords(v as never)).toMatch(words);
  });
});

describe("describeNextOrientation", () => {
  test("no turning needed below the gap limit", () => {
    expect(describeNextOrientation([0, 0, 1], GAP_WORTH_FILLING_DEG - 1)).toMatch(/No gap/);
  });

  test.each([
    // Field 60° below the horizon towards north (a typical mid-latitude dip, from memory).
    // Nose along the field: from level facing north, pitch the nose down by the dip.
    { label: "nose", gap: [1, 0, 0], expected: [/the nose/, /pitch the nose down about 60°/] },
    // Underside along the field: from level facing north, the underside already points 30° off it; pitch the nose up 30°.
    { label: "underside", gap: [0, 0, 1], expected: [/the underside/, /pitch the nose up about 30°/] },
    // Right side along the field: roll right by 90° then pitch... the words must at least name a roll to the right.
    { label: "right side", gap: [0, 1, 0], expected: [/the right side/, /roll about \d+° to the right/] },
  ])("names the body direction and an attitude: $label", ({ gap, expected }) => {
    const words = describeNextOrientation(gap as never, 40, 60);
    for (const e of expected) expect(words).toMatch(e);
    expect(words).toMatch(/towards magnetic north, about 60° below the horizon/);
  });

  test("southern hemisphere: the field points up", () => {
    expect(describeNextOrientation([1, 0, 0], 40, -35)).toMatch(/35° above the horizon/);
  });
});

describe("suggestAttitude", () => {
  test.each([
    { label: "nose, dip 60°", target: [1, 0, 0], dip: 60 },
    { label: "top, dip 60°", target: [0, 0, -1], dip: 60 },
    { label: "left side, dip 70°", target: [0, -1, 0], dip: 70 },
    { label: "a slanted direction, dip −30°", target: [0.3, -0.5, 0.81], dip: -30 },
  ])("the suggested attitude really points the target along the field ($label)", ({ target, dip }) => {
    const a = suggestAttitude(target as never, dip);
    const field = [Math.cos(dip * DEG), 0, Math.sin(dip * DEG)];
    const pointed = mulMatVec(fromYawPitchRoll(a.yawDeg, a.pitchDeg, a.rollDeg), target as never);
    expect(angleBetweenDeg(pointed, field as never)).toBeLessThan(1e-6);
  });
});

describe("next-orientation advice as sentences", () => {
  // Every direction the advice can be asked about: the centre of each of the 192 coverage cells
  // (HEALPix, gridResolution 4), with gaps worth filling and not, at a northern mid-latitude dip
  // (60°, from memory), a southern one (−35°), the magnetic equator (0°) and near a magnetic pole (85°).
  const RESOLUTION = 4;
  const cells = Array.from({ length: cellCount(RESOLUTION) }, (_, index) => index);
  const rows = [60, -35, 0, 85].flatMap((dip) =>
    [40, 120, GAP_WORTH_FILLING_DEG - 1].flatMap((gapDeg) =>
      cells.map((cell) => ({ label: `cell ${cell}, gap ${gapDeg}°, dip ${dip}°`, centre: cellCentre(cell, RESOLUTION), gapDeg, dip })),
    ),
  );
  // The body axes and the direction that is already along the field (no turn needed).
  const named = [
    ...[
      { label: "nose", centre: [1, 0, 0] },
      { label: "tail", centre: [-1, 0, 0] },
      { label: "right side", centre: [0, 1, 0] },
      { label: "left side", centre: [0, -1, 0] },
      { label: "underside", centre: [0, 0, 1] },
      { label: "top", centre: [0, 0, -1] },
      { label: "already along a 60° field", centre: [Math.cos(60 * DEG), 0, Math.sin(60 * DEG)] },
    ].map((row) => ({ ...row, gapDeg: 40, dip: 60 })),
    ...rows,
  ] as { label: string; centre: Vec3; gapDeg: number; dip: number }[];

  const coverage = (centre: Vec3, gapDeg: number, dip: number): CoverageResult => ({
    cellCount: cellCount(RESOLUTION),
    minSamplesPerCell: 3,
    coveredFraction: 0.3,
    cellCounts: new Array<number>(cellCount(RESOLUTION)).fill(0),
    largestGapDeg: gapDeg,
    gapCentre: centre,
    nextOrientation: describeNextOrientation(centre, gapDeg, dip),
    gridResolution: RESOLUTION,
  });
  const thresholds = resolveThresholds();

  test.each(named)("$label: one full stop at the end, never two in a row", ({ centre, gapDeg, dip }) => {
    const result = coverage(centre, gapDeg, dip);
    // The advice itself, and the remedies of the coverage and gap checks that carry it.
    const texts = [
      result.nextOrientation,
      coverageCheck("compass_a", result, thresholds).remedy,
      gapCheck("compass_a", result, thresholds).remedy,
    ];
    for (const text of texts) {
      if (text === null) continue;
      expect(text).not.toContain("..");
      expect(text).toMatch(/[^.\s]\.$/);
    }
  });

  test("the direction already along the field needs no turn", () => {
    expect(describeNextOrientation([Math.cos(60 * DEG), 0, Math.sin(60 * DEG)], 40, 60)).toMatch(
      /Holding it level with the nose towards magnetic north does this\.$/,
    );
  });
});
