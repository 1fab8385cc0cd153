import { describe, expect, test } from "vitest";
import { computeScenarioPreview, expectedField } from "@/components/classroom/scenario-preview-compute";
import { magneticReference } from "@/geometry/magnetic-reference";
import { DEFAULT_SCENARIO } from "@/geometry/scenario";

describe("expectedField", () => {
  test("is the World Magnetic Model's field at noon UTC of the date (WMM2025 through the geomagnetism package)", () => {
    const reference = magneticReference(DEFAULT_SCENARIO.site, new Date(`${DEFAULT_SCENARIO.date}T12:00:00Z`));
    const field = expectedField(DEFAULT_SCENARIO.site, DEFAULT_SCENARIO.date);
    expect(field?.fieldStrengthMicrotesla).toBe(reference.fieldStrengthMicrotesla);
    expect(field?.inclinationDeg).toBe(reference.inclinationDeg);
    expect(field?.withinValidity).toBe(true);
  });

  test("a date outside every shipped model is flagged", () => {
    expect(expectedField(DEFAULT_SCENARIO.site, "2035-06-01")?.withinValidity).toBe(false);
  });

  test("coordinates the model cannot take give null rather than throwing", () => {
    expect(expectedField({ latitudeDeg: 95, longitudeDeg: 0, altitudeM: 0 }, "2026-10-01")).toBeNull();
  });
});

describe("computeScenarioPreview", () => {
  test.each([
    ["a full tumble with mild soft iron passes", DEFAULT_SCENARIO, "pass", false],
    ["never turned over fails", { ...DEFAULT_SCENARIO, path: "upper-half" as const }, "fail", false],
    [
      "a motor run asks for the cautions",
      { ...DEFAULT_SCENARIO, currentCoupling: { perAmpMicrotesla: [0.4, 0, 0.5] as [number, number, number], maxAmps: 25 } },
      null,
      true,
    ],
  ])("%s", (_label, spec, verdict, powersMotors) => {
    const preview = computeScenarioPreview(spec);
    if (verdict) expect(preview.snapshot.verdict).toBe(verdict);
    expect(preview.powersMotors).toBe(powersMotors);
    expect(preview.snapshot.position).toBe(preview.snapshot.totalSamples);
    expect(preview.snapshot.view?.pointsShown).toBeLessThanOrEqual(1500);
  });

  test("a failing scenario comes with likely causes; the same spec gives the same preview", () => {
    const spec = { ...DEFAULT_SCENARIO, path: "yaw-only" as const };
    const a = computeScenarioPreview(spec);
    expect(a.diagnosis.length).toBeGreaterThan(0);
    expect(JSON.stringify(computeScenarioPreview(spec))).toBe(JSON.stringify(a));
  });
});
