import { describe, expect, test } from "vitest";
import { faceAxis, groupPoses, nearestFace, summariseFaces, wobbleAboveNoise } from "@/geometry/accelerometer-poses";
import { holdGeometry } from "@/geometry/hold-geometry";
import { findStillPeriods } from "@/geometry/still-periods";
import { accelerometerRecording, SIX_FACES, type HoldSpec, type RecordingSpec } from "./support/accelerometer-recording";

const DEG = Math.PI / 180;

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

describe("wobble above the sensor's noise floor", () => {
  test.each([
    { label: "a quiet sensor", noise: 0.02 },
    { label: "a noisy sensor", noise: 0.2 },
  ])("the sensor's white noise is measured from the holds ($label)", ({ noise }) => {
    const poses = posesOf(
      SIX_FACES.map((face) => ({ face, holdS: 6 })),
      { noise },
    );
    for (const pose of poses) expect(pose.noiseStd / noise).toBeGreaterThan(0.9);
    for (const pose of poses) expect(pose.noiseStd / noise).toBeLessThan(1.1);
  });

  test("noise alone: a still hold from a noisy sensor shows no wobble, though its raw block angles scatter", () => {
    const poses = posesOf(
      SIX_FACES.map((face) => ({ face, holdS: 6 })),
      { noise: 0.2 },
    );
    for (const pose of poses) {
      // 0.1 s blocks of 5 samples: √(2/5)·0.2/9.81 rad ≈ 0.74° of scatter from noise alone.
      expect(pose.noiseFloorDeg).toBeGreaterThan(0.6);
      expect(pose.noiseFloorDeg).toBeLessThan(0.8);
      expect(pose.wobbleDeg).toBeLessThan(0.3);
    }
  });

  test("a real wobble shows through a noisy sensor", () => {
    const poses = posesOf(
      [
        { face: "+z", holdS: 6 },
        { face: "-y", holdS: 6, wobbleDeg: 2 },
      ],
      { noise: 0.2 },
    );
    // 2° amplitude, RMS 2/√2 ≈ 1.41°; what remains above the floor is most of it.
    expect(poses[1].wobbleDeg).toBeGreaterThan(1);
    expect(poses[1].wobbleDeg).toBeLessThan(1.7);
    expect(poses[0].wobbleDeg).toBeLessThan(0.3);
  });

  test("wobbleAboveNoise removes the floor in quadrature, with its chance scatter allowed", () => {
    // 40 blocks: the allowance is (1 + 3/√40) floors squared.
    const { wobbleDeg, noiseFloorDeg } = wobbleAboveNoise(2, 40, 5, 200, 9.8, 0.2);
    const floor = Math.sqrt((2 * 0.04 * (1 / 5 - 1 / 200)) / (9.8 * 9.8)) / DEG;
    expect(noiseFloorDeg).toBeCloseTo(floor, 9);
    expect(wobbleDeg).toBeCloseTo(Math.sqrt(4 - floor * floor * (1 + 3 / Math.sqrt(40))), 9);
    expect(wobbleAboveNoise(0.5, 40, 5, 200, 9.8, 0.2).wobbleDeg).toBe(0);
  });
});

describe("holdGeometry", () => {
  const G = 9.8;
  test("six square holds leave every term as certain as square holds do", () => {
    const square = holdGeometry(SIX_FACES.map((face) => faceAxis(face).map((v) => -G * v) as [number, number, number]));
    for (const value of square.inflation) expect(value).toBeCloseTo(1, 9);
  });

  test("holds tilted 18° weaken the fit only a little, and more tilt weakens it more", () => {
    const tilted = (deg: number) =>
      holdGeometry(
        SIX_FACES.map((face, i) => {
          // Each hold tilted by `deg` towards a different neighbouring axis.
          const axis = faceAxis(face);
          const other = faceAxis(SIX_FACES[(i + 2) % 6]);
          const t = (deg * Math.PI) / 180;
          return [0, 1, 2].map((k) => -G * (axis[k] * Math.cos(t) + other[k] * Math.sin(t))) as [number, number, number];
        }),
      ).worstInflation;
    expect(tilted(18)).toBeGreaterThan(1);
    expect(tilted(18)).toBeLessThan(1.4);
    expect(tilted(10)).toBeLessThan(tilted(18));
    expect(tilted(18)).toBeLessThan(tilted(30));
    expect(tilted(30)).toBeLessThan(tilted(40));
  });

  test("holds that never point an axis up are undetermined", () => {
    const faces = ["+z", "+z", "+x", "-x", "+y", "-y"] as const;
    expect(holdGeometry(faces.map((face) => faceAxis(face).map((v) => -G * v) as [number, number, number])).worstInflation).toBe(Infinity);
  });

  test("fewer than six holds cannot be judged", () => {
    expect(holdGeometry([[0, 0, -G]]).worstInflation).toBe(Infinity);
  });
});
