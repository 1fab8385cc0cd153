import { describe, expect, test } from "vitest";
import { freeAirGradient, normalGravity, normalGravityOnEllipsoid, STANDARD_GRAVITY_MPS2, WGS84 } from "@/geometry/gravity";

describe("STANDARD_GRAVITY_MPS2", () => {
  test("is 9.80665 m/s² (CGPM 1901)", () => {
    expect(STANDARD_GRAVITY_MPS2).toBe(9.80665);
  });
});

describe("normalGravityOnEllipsoid", () => {
  test.each([
    // NIMA TR8350.2, table 3.4: normal gravity at the equator and at the poles.
    { label: "equator (NIMA TR8350.2)", lat: 0, expected: 9.7803253359 },
    { label: "north pole (NIMA TR8350.2)", lat: 90, expected: 9.8321849378 },
    { label: "south pole (NIMA TR8350.2)", lat: -90, expected: 9.8321849378 },
  ])("$label", ({ lat, expected }) => {
    expect(normalGravityOnEllipsoid(lat)).toBeCloseTo(expected, 9);
  });

  test("Somigliana's constant is consistent with a, b, γe and γp (NIMA TR8350.2)", () => {
    const b = WGS84.semiMajorAxisM * (1 - WGS84.flattening);
    const k = (b * WGS84.polarGravityMps2) / (WGS84.semiMajorAxisM * WGS84.equatorialGravityMps2) - 1;
    expect(k).toBeCloseTo(WGS84.somiglianaK, 10);
  });

  test.each([
    { label: "15°", lat: 15 },
    { label: "45°", lat: 45 },
    { label: "75°", lat: 75 },
  ])("rises monotonically from equator to pole and is symmetric ($label)", ({ lat }) => {
    expect(normalGravityOnEllipsoid(lat)).toBeGreaterThan(normalGravityOnEllipsoid(lat - 10));
    expect(normalGravityOnEllipsoid(-lat)).toBe(normalGravityOnEllipsoid(lat));
  });
});

describe("normalGravity", () => {
  test.each([
    { label: "sea level equals the ellipsoid value", lat: 30 },
    { label: "sea level at the pole", lat: 90 },
  ])("$label", ({ lat }) => {
    expect(normalGravity(lat, 0)).toBe(normalGravityOnEllipsoid(lat));
  });

  // From memory: the free-air gradient is about −3.086 µm/s² per metre (−0.3086 mGal/m).
  test.each([
    { label: "equator", lat: 0 },
    { label: "45°", lat: 45 },
    { label: "pole", lat: 90 },
  ])("1 km up loses about 3.086 mm/s² at the $label", ({ lat }) => {
    const drop = normalGravity(lat, 0) - normalGravity(lat, 1000);
    expect(drop / 1000).toBeGreaterThan(3.07e-6);
    expect(drop / 1000).toBeLessThan(3.1e-6);
  });

  test.each([
    { label: "equator", lat: 0 },
    { label: "45°", lat: 45 },
  ])("free-air gradient ≈ −3.086e-6 s⁻² at the $label (from memory)", ({ lat }) => {
    expect(freeAirGradient(lat)).toBeCloseTo(-3.086e-6, 8);
  });

  test("the second-order term is small but positive at 10 km", () => {
    const linear = normalGravity(45, 0) + freeAirGradient(45) * 10_000;
    const full = normalGravity(45, 10_000);
    expect(full - linear).toBeGreaterThan(0);
    expect(full - linear).toBeLessThan(1e-3);
  });
});
