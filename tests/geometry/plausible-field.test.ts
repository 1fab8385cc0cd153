import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, test } from "vitest";
import { analyseCapture } from "@/geometry/analyse-capture";
import { dateFromDecimalYear, magneticReference } from "@/geometry/magnetic-reference";
import {
  FIELD_BAND_ALTITUDE_M,
  PLAUSIBLE_FIELD_MARGIN_FRACTION,
  modelFieldBand,
  modelFieldStrengthAt,
  plausibleFieldLimits,
} from "@/geometry/plausible-field";
import { simulateCapture } from "@/geometry/simulator";
import { THRESHOLDS, grade } from "@/geometry/thresholds";

// Source: the WMM2025 test values shipped with the geomagnetism package
// (node_modules/geomagnetism/test/values.csv): altitude in km, field strength f in nT.
const shippedRows = readFileSync(path.resolve(__dirname, "../../node_modules/geomagnetism/test/values.csv"), "utf8")
  .trim()
  .split(/\r?\n/)
  .slice(1)
  .map((line) => line.split(",").map(Number))
  .map(([date, alt, lat, lon, , , , , f]) => ({ date, alt, lat, lon, f }))
  .filter((row) => row.date >= 2025);

interface Spot {
  strength: number;
  lat: number;
  lon: number;
  altitudeM: number;
  year: number;
}

/**
 * An independent search through the product's own model evaluation (magneticReference, which
 * holds dates past the package's last valid day at that day): a 3° grid at both ends of the
 * window and at three heights, then a finer look around the best grid point.
 */
function searchModel(better: (a: number, b: number) => boolean): Spot {
  const years = [2025.0, 2029.9];
  const heights = [FIELD_BAND_ALTITUDE_M.lowest, 0, FIELD_BAND_ALTITUDE_M.highest];
  const at = (lat: number, lon: number, altitudeM: number, year: number): Spot => ({
    strength: magneticReference({ latitudeDeg: lat, longitudeDeg: lon, altitudeM }, dateFromDecimalYear(year)).fieldStrengthMicrotesla,
    lat,
    lon,
    altitudeM,
    year,
  });
  let best: Spot | null = null;
  for (const year of years)
    for (const altitudeM of heights)
      for (let lat = -90; lat <= 90; lat += 3)
        for (let lon = -180; lon < 180; lon += 3) {
          const spot = at(lat, lon, altitudeM, year);
          if (!best || better(spot.strength, best.strength)) best = spot;
        }
  const coarse = best!;
  for (let dLat = -3; dLat <= 3; dLat += 0.25)
    for (let dLon = -3; dLon <= 3; dLon += 0.25) {
      const spot = at(Math.max(-90, Math.min(90, coarse.lat + dLat)), coarse.lon + dLon, coarse.altitudeM, coarse.year);
      if (better(spot.strength, best!.strength)) best = spot;
    }
  return best!;
}

const weakest = searchModel((a, b) => a < b);
const strongest = searchModel((a, b) => a > b);
const band = modelFieldBand();

describe("modelFieldBand", () => {
  test("the field moves in a straight line in time: it matches the shipped WMM2025 test values", () => {
    expect(shippedRows.length).toBeGreaterThanOrEqual(10);
    for (const row of shippedRows) {
      // Components are printed to 1e-6 nT; allow 1 nT for the package's arithmetic.
      expect(Math.abs(modelFieldStrengthAt(row.lat, row.lon, row.alt * 1000, row.date) * 1000 - row.f)).toBeLessThan(1);
    }
  });

  test("it reaches at least as low and as high as a search of the model by other means", () => {
    expect(band.weakest.strengthMicrotesla).toBeLessThanOrEqual(weakest.strength + 1e-9);
    expect(band.strongest.strengthMicrotesla).toBeGreaterThanOrEqual(strongest.strength - 1e-9);
    // …and not by more than the extra tenth of a year and the refinement can explain.
    expect(weakest.strength - band.weakest.strengthMicrotesla).toBeLessThan(0.05);
    expect(band.strongest.strengthMicrotesla - strongest.strength).toBeLessThan(0.05);
  });

  test("its extremes are what the model gives at the places and times it names", () => {
    const { weakest: low, strongest: high } = band;
    expect(modelFieldStrengthAt(low.latitudeDeg, low.longitudeDeg, low.altitudeM, low.decimalYear)).toBeCloseTo(low.strengthMicrotesla, 9);
    expect(modelFieldStrengthAt(high.latitudeDeg, high.longitudeDeg, high.altitudeM, high.decimalYear)).toBeCloseTo(
      high.strengthMicrotesla,
      9,
    );
  });

  test("computed once and kept", () => {
    expect(modelFieldBand()).toBe(band);
  });

  // The reason the band is computed: a fixed 22 µT floor (WMM2025 at 2025.0) is undercut in the
  // South Atlantic before the model expires.
  test("the South Atlantic low at sea level falls below 22 µT by 2029.9", () => {
    expect(modelFieldStrengthAt(weakest.lat, weakest.lon, 0, 2029.9)).toBeLessThan(22);
  });
});

describe("plausibleFieldLimits", () => {
  const limits = plausibleFieldLimits();

  test("the warning limits are the model's band widened by the margin, rounded outwards", () => {
    expect(limits.warnBelow).toBeLessThanOrEqual(band.weakest.strengthMicrotesla * (1 - PLAUSIBLE_FIELD_MARGIN_FRACTION));
    expect(limits.warnBelow).toBeGreaterThan(band.weakest.strengthMicrotesla * (1 - PLAUSIBLE_FIELD_MARGIN_FRACTION) - 0.1);
    expect(limits.warnAbove).toBeGreaterThanOrEqual(band.strongest.strengthMicrotesla * (1 + PLAUSIBLE_FIELD_MARGIN_FRACTION));
    expect(limits.warnAbove).toBeLessThan(band.strongest.strengthMicrotesla * (1 + PLAUSIBLE_FIELD_MARGIN_FRACTION) + 0.1);
  });

  test("the threshold table uses them", () => {
    expect(THRESHOLDS["mag.field-plausible"].warnBelow).toBe(limits.warnBelow);
    expect(THRESHOLDS["mag.field-plausible"].warnAbove).toBe(limits.warnAbove);
  });

  test.each([
    { label: "the weakest spot found", spot: weakest },
    { label: "the strongest spot found", spot: strongest },
  ])("a field exactly as the model gives it at $label passes, at every height and both ends of the window", ({ spot }) => {
    for (const altitudeM of [FIELD_BAND_ALTITUDE_M.lowest, 0, 3000, FIELD_BAND_ALTITUDE_M.highest])
      for (const year of [2025.0, 2027.5, 2029.9, 2030.0])
        expect(grade(modelFieldStrengthAt(spot.lat, spot.lon, altitudeM, year), THRESHOLDS["mag.field-plausible"])).toBe("pass");
  });
});

describe("a clean capture at the model's extremes", () => {
  test.each([
    { label: "the South Atlantic low at 2029.9", spot: weakest, year: 2029.9 },
    { label: "the strongest field at 2025.0", spot: strongest, year: 2025.0 },
  ])("is not warned on for field strength: $label", ({ spot, year }) => {
    const site = { latitudeDeg: spot.lat, longitudeDeg: spot.lon, altitudeM: 0 };
    const date = dateFromDecimalYear(year);
    const { table } = simulateCapture({
      seed: 21,
      siteFieldNed: magneticReference(site, date).fieldNedMicrotesla,
      magnetometers: [{ hardIronOffset: [6, -3, 9], softIron: "mild" }],
    });
    const analysis = analyseCapture(table, { site, date, units: { magnetic: { kind: "magnetic", unit: "uT" } }, bootstrap: false });
    const plausible = analysis.checks.find((c) => c.id === "mag.field-plausible" && c.sensor === "compass_a")!;
    expect(plausible.status).toBe("pass");
    expect(plausible.explanation).toMatch(/^The fitted field is .* µT\. WMM-2025 puts the Earth's main field between .* µT .*\.$/);
    expect(analysis.checks.find((c) => c.id === "mag.field-vs-model" && c.sensor === "compass_a")!.status).toBe("pass");
  });
});
