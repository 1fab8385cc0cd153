import { describe, expect, test } from "vitest";
import type { BodyFace } from "@/geometry/magnetometer-types";
import { createRandom } from "@/geometry/random";
import { angleBetweenRotationsDeg } from "@/geometry/rotation";
import {
  faceAttitude,
  holdSegment,
  joinSegments,
  pathSegment,
  spiralSegment,
  STEADY_SPIN_RATE_DEG_PER_S,
} from "@/geometry/simulator-paths";
import type { Vec3 } from "@/geometry/types";
import { angleBetweenDeg, det3, mulMatVec, normalize, transpose3 } from "@/geometry/vector";

const FIELD: Vec3 = normalize([18.9, 0.6, 44.2]);

describe("faceAttitude", () => {
  test.each<{ face: BodyFace; axis: Vec3 }>([
    // The named body axis must point down (NED +z) whatever the heading.
    { face: "+z", axis: [0, 0, 1] },
    { face: "-z", axis: [0, 0, -1] },
    { face: "+x", axis: [1, 0, 0] },
    { face: "-x", axis: [-1, 0, 0] },
    { face: "+y", axis: [0, 1, 0] },
    { face: "-y", axis: [0, -1, 0] },
  ])("$face points that body axis down", ({ face, axis }) => {
    for (const heading of [0, 37, -120]) {
      expect(angleBetweenDeg(mulMatVec(faceAttitude(face, heading), axis), [0, 0, 1])).toBeLessThan(1e-9);
    }
  });
});

describe("spiralSegment and pathSegment", () => {
  test.each([
    { label: "full sphere", polarMax: Math.PI },
    { label: "upper half", polarMax: (89 * Math.PI) / 180 },
  ])("attitudes are proper rotations that change smoothly (no jump above 3° in 20 ms) — $label", ({ polarMax }) => {
    const segment = spiralSegment(60, FIELD, polarMax, 16, createRandom(1));
    let previous = segment.attitude(0);
    for (let t = 0.02; t <= 60; t += 0.02) {
      const r = segment.attitude(t);
      expect(det3(r)).toBeCloseTo(1, 9);
      expect(angleBetweenRotationsDeg(previous, r)).toBeLessThan(3);
      previous = r;
    }
  });

  test("upper half: the field seen from the body never points to the underside half", () => {
    const segment = pathSegment("upper-half", 60, FIELD, createRandom(2));
    for (let t = 0; t <= 60; t += 0.1) {
      const bodyField = mulMatVec(transpose3(segment.attitude(t)), FIELD);
      expect(bodyField[2]).toBeLessThan(0.02);
    }
  });

  test("yaw-only keeps the vehicle level", () => {
    const segment = pathSegment("yaw-only", 30, FIELD, createRandom(3));
    for (let t = 0; t <= 30; t += 1) expect(angleBetweenDeg(mulMatVec(segment.attitude(t), [0, 0, 1]), [0, 0, 1])).toBeLessThan(1e-9);
  });
});

describe("the steady-spin path", () => {
  test.each([
    { label: "the default rate", rate: undefined, expected: STEADY_SPIN_RATE_DEG_PER_S },
    { label: "a chosen rate", rate: 3, expected: 3 },
  ])("stays level and turns about the vertical at one steady rate ($label)", ({ rate, expected }) => {
    const segment = pathSegment("steady-spin", 30, FIELD, createRandom(6), rate);
    let previous = segment.attitude(0);
    for (let t = 0.5; t <= 30; t += 0.5) {
      const r = segment.attitude(t);
      expect(angleBetweenDeg(mulMatVec(r, [0, 0, 1]), [0, 0, 1])).toBeLessThan(1e-9);
      expect(angleBetweenRotationsDeg(previous, r)).toBeCloseTo(expected * 0.5, 9);
      previous = r;
    }
    expect(segment.acceleration(3)).toEqual([0, 0, 0]);
  });
});

describe("holdSegment and joinSegments", () => {
  test("a tilted hold sits at the stated tilt from the exact face", () => {
    const hold = holdSegment("+x", { faces: ["+x"], tiltDeg: 7 }, createRandom(4));
    expect(angleBetweenDeg(mulMatVec(hold.attitude(1), [1, 0, 0]), [0, 0, 1])).toBeCloseTo(7, 9);
  });

  test("joins insert a move wherever the next segment starts elsewhere, ending exactly there", () => {
    const r = createRandom(5);
    const a = holdSegment("+z", { faces: ["+z"] }, r);
    const b = holdSegment("-z", { faces: ["-z"] }, r);
    const joined = joinSegments([a, b], 3, r);
    expect(joined.map((s) => s.kind)).toEqual(["hold", "move", "hold"]);
    expect(angleBetweenRotationsDeg(joined[1].attitude(3), b.attitude(0))).toBeLessThan(1e-9);
    expect(angleBetweenRotationsDeg(joined[1].attitude(0), a.attitude(a.seconds))).toBeLessThan(1e-9);
  });
});
