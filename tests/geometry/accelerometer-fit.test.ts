import { describe, expect, test } from "vitest";
import { fitAccelerometer, levelTrim } from "@/geometry/accelerometer-fit";
import { groupPoses } from "@/geometry/accelerometer-poses";
import { normalGravity } from "@/geometry/gravity";
import { findStillPeriods } from "@/geometry/still-periods";
import type { Vec3 } from "@/geometry/types";
import { accelerometerRecording, SIX_FACES, type HoldSpec, type RecordingSpec } from "./support/accelerometer-recording";

function fitOf(spec: RecordingSpec, gravityMps2?: number, model?: "auto" | "axis" | "full") {
  const recording = accelerometerRecording(spec);
  const poses = groupPoses(recording.time, recording.accel, findStillPeriods(recording.time, recording.accel));
  return { poses, result: fitAccelerometer(poses, { gravityMps2, model }) };
}

const sixFaces: HoldSpec[] = SIX_FACES.map((face) => ({ face }));

describe("fitAccelerometer", () => {
  // Invented sensor errors at typical MEMS sizes; tolerances follow from noise 0.02 m/s²
  // averaged over ~200 samples per hold (≈ 0.0015 m/s²), with margin.
  test.each([
    { label: "clean sensor", offset: [0, 0, 0], scale: [1, 1, 1], noise: 0.02 },
    { label: "offsets and scales", offset: [0.3, -0.45, 0.6], scale: [1.02, 0.97, 1.04], noise: 0.02 },
    { label: "large offsets, noisier", offset: [-1.2, 0.8, -0.9], scale: [0.95, 1.05, 0.99], noise: 0.08 },
  ] as const)("recovers offset and scale: $label", ({ offset, scale, noise }) => {
    const { result } = fitOf({ holds: sixFaces, offset: [...offset], scale: [...scale], noise });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.model).toBe("axis");
    for (let k = 0; k < 3; k++) {
      expect(Math.abs(result.offset[k] - offset[k])).toBeLessThan(0.02);
      expect(Math.abs(result.scale[k] - scale[k])).toBeLessThan(0.002);
    }
    for (const pose of result.correctedPoses) expect(pose.magnitudeMps2).toBeCloseTo(9.80665, 2);
  });

  test("fits to the local gravity given (WGS 84 normal gravity, NIMA TR8350.2)", () => {
    const local = normalGravity(60, 100);
    const { result } = fitOf({ holds: sixFaces, gravity: local, scale: [1.01, 1.01, 1.01] }, local);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.gravityMps2).toBe(local);
    for (let k = 0; k < 3; k++) expect(result.scale[k]).toBeCloseTo(1.01, 3);
    // The sensor reads 1% high before correction.
    expect(result.rawGravityMps2 / local).toBeCloseTo(1.01, 3);
  });

  test("the wrong gravity shows up as a common scale error", () => {
    const { result } = fitOf({ holds: sixFaces, gravity: 9.78 }, 9.83);
    expect(result.ok && result.scale.every((s) => Math.abs(s - 9.78 / 9.83) < 1e-3)).toBe(true);
  });

  test("a tilted hold does not spoil the fit, and its corrected angle is reported", () => {
    const holds = sixFaces.map((hold) => (hold.face === "-x" ? { ...hold, tiltDeg: 12 } : hold));
    const { result } = fitOf({ holds, offset: [0.2, 0.1, -0.3], scale: [1.01, 0.99, 1.02] });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const tilted = result.correctedPoses.find((pose) => pose.face === "-x")!;
    expect(tilted.angleFromAxisDeg).toBeCloseTo(12, 0);
    expect(Math.abs(result.offset[0] - 0.2)).toBeLessThan(0.03);
  });

  test.each([
    { label: "five faces", holds: sixFaces.slice(0, 5), reason: "too-few-poses", detail: /missing: on its left side \(-y down\)/ },
    {
      label: "six poses but no nose-up or nose-down",
      holds: [{ face: "+z" }, { face: "-z" }, { face: "+y" }, { face: "-y" }, { face: "+z", tiltDeg: 30 }, { face: "-z", tiltDeg: 25 }],
      reason: "degenerate",
      detail: /missing: nose down \(\+x down\), nose up \(-x down\)/,
    },
  ] as const)("refuses $label", ({ holds, reason, detail }) => {
    const { result } = fitOf({ holds: holds.map((h) => ({ ...h })) });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.reason).toBe(reason);
    expect(result.detail).toMatch(detail);
  });

  test("with extra in-between poses, the full model recovers a symmetric misalignment", () => {
    // Gain with a 1° symmetric xy coupling: off-diagonal sin(1°) ≈ 0.01745.
    const holds: HoldSpec[] = [
      ...sixFaces,
      { face: "+z", tiltDeg: 40 },
      { face: "+x", tiltDeg: 40 },
      { face: "+y", tiltDeg: 40 },
      { face: "-z", tiltDeg: 35 },
    ];
    const recording = accelerometerRecording({ holds, noise: 0.005 });
    const coupling = Math.sin(Math.PI / 180);
    for (let i = 0; i < recording.time.length; i++) {
      const x = recording.accel.x[i];
      const y = recording.accel.y[i];
      recording.accel.x[i] = x + coupling * y;
      recording.accel.y[i] = y + coupling * x;
    }
    const poses = groupPoses(recording.time, recording.accel, findStillPeriods(recording.time, recording.accel));
    const auto = fitAccelerometer(poses);
    const axisOnly = fitAccelerometer(poses, { model: "axis" });
    expect(auto.ok && axisOnly.ok).toBe(true);
    if (!auto.ok || !axisOnly.ok) return;
    expect(auto.model).toBe("full");
    expect(auto.misalignmentDeg[0]).toBeCloseTo(1, 1);
    expect(Math.abs(auto.misalignmentDeg[1])).toBeLessThan(0.1);
    expect(auto.residualRmsMps2).toBeLessThan(axisOnly.residualRmsMps2 / 5);
  });

  test("six faces only: the full model is not claimed", () => {
    const { result } = fitOf({ holds: sixFaces }, undefined, "full");
    expect(result.ok && result.model).toBe("axis");
    expect(result.ok && result.modelReason).toMatch(/at least 9/);
  });
});

describe("levelTrim", () => {
  const pose = (specificForce: Vec3, durationS = 4) => ({
    face: "+z" as const,
    durationS,
    specificForce,
    magnitudeMps2: 9.8,
    angleFromAxisDeg: 0,
  });
  const g = 9.8;
  const d = Math.PI / 180;
  test.each([
    { label: "level", f: [0, 0, -g], roll: 0, pitch: 0 },
    // Nose up by θ reads f = (g sinθ, 0, −g cosθ); right wing down by φ reads f = (0, −g sinφ, −g cosφ).
    { label: "nose up 2°", f: [g * Math.sin(2 * d), 0, -g * Math.cos(2 * d)], roll: 0, pitch: 2 },
    { label: "right side down 1.5°", f: [0, -g * Math.sin(1.5 * d), -g * Math.cos(1.5 * d)], roll: 1.5, pitch: 0 },
  ] as const)("$label", ({ f, roll, pitch }) => {
    const trim = levelTrim([pose([...f])]);
    expect(trim!.rollDeg).toBeCloseTo(roll, 9);
    expect(trim!.pitchDeg).toBeCloseTo(pitch, 9);
  });

  test("uses the longest level hold; none without a level pose", () => {
    const trim = levelTrim([pose([0, 0, -g], 2), pose([g * Math.sin(3 * d), 0, -g * Math.cos(3 * d)], 6)]);
    expect(trim!.pitchDeg).toBeCloseTo(3, 9);
    expect(levelTrim([{ ...pose([0, 0, g]), face: "-z" }])).toBeNull();
  });
});
