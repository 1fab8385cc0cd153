import { describe, expect, test } from "vitest";
import { faceAxis, groupPoses, nearestFace, summariseFaces } from "@/geometry/accelerometer-poses";
import { findStillPeriods } from "@/geometry/still-periods";
import { accelerometerRecording, SIX_FACES, type HoldSpec, type RecordingSpec } from "./support/accelerometer-recording";

function posesOf(holds: HoldSpec[], extra: Partial<RecordingSpec> = {}) {
  const recording = accelerometerRecording({ holds, ...extra });
  const periods = findStillPeriods(recording.time, recording.accel);
  return groupPoses(recording.time, recording.accel, periods);
}

describe("nearestFace", () => {
  // Body frame x forward, y right, z down; at rest the reading points up.
  test.each([
    { label: "level reads −g on z", reading: [0, 0, -9.8], face: "+z" },
    { label: "upside down reads +g on z", reading: [0, 0, 9.8], face: "-z" },
    { label: "nose down reads −g on x", reading: [-9.8, 0, 0], face: "+x" },
    { label: "nose up reads +g on x", reading: [9.8, 0, 0], face: "-x" },
    { label: "right side down reads −g on y", reading: [0, -9.8, 0], face: "+y" },
    { label: "left side down reads +g on y", reading: [0, 9.8, 0], face: "-y" },
  ] as const)("$label → $face", ({ reading, face }) => {
    const result = nearestFace([...reading]);
    expect(result.face).toBe(face);
    expect(result.angleFromAxisDeg).toBeCloseTo(0, 10);
  });

  test.each([
    { label: "10° from level", reading: [0, -9.8 * Math.sin(Math.PI / 18), -9.8 * Math.cos(Math.PI / 18)], angle: 10 },
    { label: "the body diagonal is 54.7° from every axis", reading: [-1, -1, -1], angle: (Math.acos(1 / Math.sqrt(3)) * 180) / Math.PI },
  ] as const)("$label", ({ reading, angle }) => {
    expect(nearestFace([...reading]).angleFromAxisDeg).toBeCloseTo(angle, 9);
  });
});

describe("faceAxis", () => {
  test("returns a fresh unit vector", () => {
    const axis = faceAxis("-y");
    expect(axis).toEqual([0, -1, 0]);
    axis[1] = 5;
    expect(faceAxis("-y")).toEqual([0, -1, 0]);
  });
});

describe("groupPoses", () => {
  test("six holds give six poses on the six faces, in order", () => {
    const poses = posesOf(SIX_FACES.map((face) => ({ face })));
    expect(poses.map((pose) => pose.face)).toEqual(SIX_FACES);
    for (const pose of poses) {
      expect(pose.angleFromAxisDeg).toBeLessThan(1);
      expect(pose.wobbleDeg).toBeLessThan(0.2);
      expect(pose.durationS).toBeGreaterThan(3);
    }
  });

  test.each([
    { label: "8°", tiltDeg: 8 },
    { label: "20°", tiltDeg: 20 },
  ])("a tilted hold shows its tilt ($label)", ({ tiltDeg }) => {
    const poses = posesOf([{ face: "+z" }, { face: "+x", tiltDeg }, { face: "-z" }]);
    expect(poses[1].face).toBe("+x");
    expect(poses[1].angleFromAxisDeg).toBeCloseTo(tiltDeg, 0);
    expect(poses[0].angleFromAxisDeg).toBeLessThan(1);
  });

  test.each([
    { label: "1°", wobbleDeg: 1 },
    { label: "2°", wobbleDeg: 2 },
  ])("a wobbly hold shows its wobble ($label amplitude, RMS = amplitude/√2)", ({ wobbleDeg }) => {
    const poses = posesOf([{ face: "+z" }, { face: "-y", wobbleDeg }]);
    expect(poses[1].wobbleDeg).toBeGreaterThan(0.8 * (wobbleDeg / Math.SQRT2));
    expect(poses[1].wobbleDeg).toBeLessThan(1.2 * (wobbleDeg / Math.SQRT2));
    expect(poses[0].wobbleDeg).toBeLessThan(0.2);
  });

  test("a hold interrupted by a twitch stays one pose", () => {
    const recording = accelerometerRecording({ holds: [{ face: "+z", holdS: 8 }] });
    for (let i = 180; i < 190; i++) recording.accel.x[i] += 3;
    const periods = findStillPeriods(recording.time, recording.accel);
    expect(periods.length).toBe(2);
    const poses = groupPoses(recording.time, recording.accel, periods);
    expect(poses).toHaveLength(1);
    expect(poses[0].sampleCount).toBe(periods[0].endIndex - periods[0].startIndex + periods[1].endIndex - periods[1].startIndex);
  });
});

describe("summariseFaces", () => {
  test("missing faces are named and repeats noted", () => {
    const poses = posesOf([{ face: "+z", holdS: 3 }, { face: "-z" }, { face: "+x" }, { face: "+z", holdS: 6 }]);
    const summary = summariseFaces(poses);
    expect(summary.missingFaces).toEqual(["-x", "+y", "-y"]);
    expect(summary.repeatedFaces).toEqual(["+z"]);
    expect(summary.poseByFace["+z"]).toBe(3); // the longer level hold
  });

  test("all six faces: nothing missing", () => {
    expect(summariseFaces(posesOf(SIX_FACES.map((face) => ({ face })))).missingFaces).toEqual([]);
  });
});
