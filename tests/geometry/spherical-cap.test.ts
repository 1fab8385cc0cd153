import { describe, expect, test } from "vitest";
import { capBoundary } from "@/geometry/spherical-cap";
import type { Vec3 } from "@/geometry/types";
import { angleBetweenDeg, cross, dot, norm } from "@/geometry/vector";

describe("capBoundary", () => {
  test.each([
    { label: "round up, 30°", centre: [0, 0, -1] as Vec3, radiusDeg: 30 },
    { label: "round the nose, 90° (a great circle)", centre: [2, 0, 0] as Vec3, radiusDeg: 90 },
    { label: "oblique centre, 127°", centre: [0.3, -0.5, 0.8] as Vec3, radiusDeg: 127 },
    { label: "along y, 5°", centre: [0, 1, 0] as Vec3, radiusDeg: 5 },
  ])("unit points at the radius, counter-clockwise seen from outside: $label", ({ centre, radiusDeg }) => {
    const points = capBoundary(centre, radiusDeg, 64);
    expect(points.length).toBe(64);
    for (const p of points) {
      expect(norm(p)).toBeCloseTo(1, 12);
      expect(angleBetweenDeg(p, centre)).toBeCloseTo(radiusDeg, 9);
    }
    // Consecutive points turn positively about the centre.
    for (let k = 0; k < points.length; k++) {
      expect(dot(cross(points[k], points[(k + 1) % points.length]), centre)).toBeGreaterThan(0);
    }
  });

  test.each([
    { label: "negative radius clamps to the centre", radiusDeg: -10, angle: 0 },
    { label: "over 180° clamps to the antipode", radiusDeg: 250, angle: 180 },
  ])("$label", ({ radiusDeg, angle }) => {
    for (const p of capBoundary([0, 1, 0], radiusDeg, 8)) expect(angleBetweenDeg(p, [0, 1, 0])).toBeCloseTo(angle, 6);
  });
});
