import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, test } from "vitest";
import { dateFromDecimalYear, magneticReference } from "@/geometry/magnetic-reference";
import { modelFieldBand } from "@/geometry/plausible-field";

// Source: the WMM2025 test values shipped with the geomagnetism package
// (node_modules/geomagnetism/test/values.csv). Altitude is in km; components in nT;
// inclination and declination in degrees, printed to 0.01°.
function shippedTestValues() {
  const text = readFileSync(path.resolve(__dirname, "../../node_modules/geomagnetism/test/values.csv"), "utf8");
  const [header, ...lines] = text.trim().split(/\r?\n/);
  const names = header.split(",");
  return lines.map((line) => {
    const cells = line.split(",").map(Number);
    return Object.fromEntries(names.map((name, i) => [name, cells[i]])) as Record<string, number>;
  });
}

const wmm2025Rows = shippedTestValues()
  .filter((row) => row.date === 2025.0 || row.date === 2027.5)
  .map((row) => ({ label: `${row.date} ${row.lat}°,${row.lon}° ${row.alt} km`, row }));

describe("magneticReference", () => {
  test("the shipped table has the 2025.0 and 2027.5 rows", () => {
    expect(wmm2025Rows.length).toBe(20);
  });

  test.each(wmm2025Rows)("WMM2025 test value $label", ({ row }) => {
    const reference = magneticReference(
      { latitudeDeg: row.lat, longitudeDeg: row.lon, altitudeM: row.alt * 1000 },
      dateFromDecimalYear(row.date),
    );
    expect(reference.modelName).toBe("WMM-2025");
    expect(reference.withinValidity).toBe(true);
    // Angles are printed to 0.01°: half a unit of rounding, plus a hair for arithmetic.
    expect(Math.abs(reference.inclinationDeg - row.incl)).toBeLessThanOrEqual(0.006);
    expect(Math.abs(reference.declinationDeg - row.decl)).toBeLessThanOrEqual(0.006);
    // Components are printed to 1e-6 nT; allow 1 nT (0.001 µT) for the package's arithmetic.
    const [north, east, down] = reference.fieldNedMicrotesla;
    expect(Math.abs(north * 1000 - row.x)).toBeLessThan(1);
    expect(Math.abs(east * 1000 - row.y)).toBeLessThan(1);
    expect(Math.abs(down * 1000 - row.z)).toBeLessThan(1);
    expect(Math.abs(reference.horizontalMicrotesla * 1000 - row.h)).toBeLessThan(1);
    expect(Math.abs(reference.fieldStrengthMicrotesla * 1000 - row.f)).toBeLessThan(1);
  });

  // From memory, the surface field lies within 25–65 µT; WMM2025 itself reaches down to
  // ~22 µT in the South Atlantic anomaly and up to ~67 µT south of Australia. The checks'
  // plausible range is the model's band over its validity (plausible-field.ts).
  const band = modelFieldBand();
  const grid = [];
  for (let lat = -90; lat <= 90; lat += 15) {
    for (let lon = -180; lon < 180; lon += 30) grid.push({ label: `${lat}°,${lon}°`, lat, lon });
  }
  test.each(grid)("field strength at sea level inside the model's band at $label", ({ lat, lon }) => {
    const reference = magneticReference({ latitudeDeg: lat, longitudeDeg: lon, altitudeM: 0 }, new Date("2026-06-01"));
    expect(reference.fieldStrengthMicrotesla).toBeGreaterThan(Math.max(20, band.weakest.strengthMicrotesla));
    expect(reference.fieldStrengthMicrotesla).toBeLessThan(Math.min(70, band.strongest.strengthMicrotesla));
  });

  test("inclination, strength and components agree with each other", () => {
    const reference = magneticReference({ latitudeDeg: -33.9, longitudeDeg: 18.4, altitudeM: 20 }, new Date("2026-01-15"));
    const [n, e, d] = reference.fieldNedMicrotesla;
    expect(Math.hypot(n, e, d)).toBeCloseTo(reference.fieldStrengthMicrotesla, 9);
    expect((Math.atan2(d, Math.hypot(n, e)) * 180) / Math.PI).toBeCloseTo(reference.inclinationDeg, 6);
    expect((Math.atan2(e, n) * 180) / Math.PI).toBeCloseTo(reference.declinationDeg, 6);
  });

  test.each([
    { label: "after WMM2025 expires", date: new Date("2031-05-01"), evaluated: new Date("2029-11-13T03:00:00Z") },
    { label: "before the oldest shipped model", date: new Date("2010-05-01"), evaluated: new Date("2014-12-15T07:00:00Z") },
  ])("outside validity ($label): evaluated at the nearest valid date and flagged", ({ date, evaluated }) => {
    const reference = magneticReference({ latitudeDeg: 10, longitudeDeg: 20, altitudeM: 0 }, date);
    expect(reference.withinValidity).toBe(false);
    expect(reference.evaluatedDate.getTime()).toBe(evaluated.getTime());
    expect(reference.requestedDate).toBe(date);
  });

  test.each([
    { label: "latitude beyond the pole", site: { latitudeDeg: 91, longitudeDeg: 0, altitudeM: 0 } },
    { label: "longitude not a number", site: { latitudeDeg: 0, longitudeDeg: Number.NaN, altitudeM: 0 } },
  ])("rejects $label", ({ site }) => {
    expect(() => magneticReference(site, new Date("2026-01-01"))).toThrow(RangeError);
  });
});

describe("dateFromDecimalYear", () => {
  test.each([
    { label: "start of year", year: 2025.0, iso: "2025-01-01T00:00:00.000Z" },
    { label: "half of a common year", year: 2027.5, iso: "2027-07-02T12:00:00.000Z" },
    { label: "half of a leap year", year: 2028.5, iso: "2028-07-02T00:00:00.000Z" },
  ])("$label", ({ year, iso }) => {
    expect(dateFromDecimalYear(year).toISOString()).toBe(iso);
  });
});
