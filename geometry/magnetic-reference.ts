/**
 * The Earth's expected magnetic field at a site and date, from the World Magnetic Model
 * (WMM2025, and the earlier models for older dates) as evaluated by the `geomagnetism`
 * package.
 */
import * as geomagnetism from "geomagnetism";
import type { Vec3 } from "./types";

/** Where a capture was made. */
export interface Site {
  /** Geodetic latitude, degrees north, −90…90. */
  latitudeDeg: number;
  /** Longitude, degrees east, −180…360. */
  longitudeDeg: number;
  /** Height above the WGS 84 ellipsoid in metres (a GNSS altitude). */
  altitudeM: number;
}

/** The model's field at a site, in the local north-east-down frame. */
export interface MagneticReference {
  /** Field vector (north, east, down), µT. */
  fieldNedMicrotesla: Vec3;
  fieldStrengthMicrotesla: number;
  horizontalMicrotesla: number;
  /** Angle of the field below the horizontal, degrees (positive in the northern hemisphere). */
  inclinationDeg: number;
  /** Angle of the horizontal field east of true north, degrees. */
  declinationDeg: number;
  /** Which model produced the values, e.g. "WMM-2025". */
  modelName: string;
  validFrom: Date;
  validTo: Date;
  /** The date asked for. */
  requestedDate: Date;
  /** The date the model was evaluated at: the requested date, or the nearest valid one. */
  evaluatedDate: Date;
  /** False when the requested date lies outside every shipped model; values are then indicative. */
  withinValidity: boolean;
}

/** Validity of the models shipped with the package, newest first (from its index). */
const SHIPPED_MODEL_SPAN = {
  earliest: new Date("2014-12-15T07:00:00.000Z"),
  latest: new Date("2029-11-13T03:00:00.000Z"),
};

/**
 * The World Magnetic Model's field at a site and date.
 *
 * Dates inside a shipped model's validity use that model (WMM2025 from 13 Nov 2024 to
 * 13 Nov 2029). Outside every model the field is evaluated at the nearest valid date and
 * `withinValidity` is false: the model's secular variation is only meant to be projected
 * across its five-year span, and the field drifts by up to ~100 nT a year (0.1 µT), so the
 * values stay good enough for a few-µT check for a year or two but must be reported as
 * outside the model.
 *
 * The model describes the main field from the Earth's core; crustal anomalies and magnetic
 * storms add a few hundred nT, and local steel far more — which is what the checks look for.
 *
 * Source: NOAA/NCEI and BGS, "The US/UK World Magnetic Model for 2025–2030" (WMM2025).
 */
export function magneticReference(site: Site, date: Date): MagneticReference {
  if (!Number.isFinite(site.latitudeDeg) || Math.abs(site.latitudeDeg) > 90) {
    throw new RangeError(`latitude ${site.latitudeDeg}° is outside −90…90°`);
  }
  if (!Number.isFinite(site.longitudeDeg)) throw new RangeError(`longitude ${site.longitudeDeg}° is not a number`);
  if (!Number.isFinite(site.altitudeM)) throw new RangeError(`altitude ${site.altitudeM} m is not a number`);
  if (Number.isNaN(date.getTime())) throw new RangeError("the date is not a valid date");

  const withinValidity = date >= SHIPPED_MODEL_SPAN.earliest && date <= SHIPPED_MODEL_SPAN.latest;
  const evaluatedDate = withinValidity
    ? date
    : new Date(Math.min(Math.max(date.getTime(), SHIPPED_MODEL_SPAN.earliest.getTime()), SHIPPED_MODEL_SPAN.latest.getTime()));

  const model = geomagnetism.model(evaluatedDate);
  // The package takes altitude in kilometres above the ellipsoid.
  const point = model.point([site.latitudeDeg, site.longitudeDeg, site.altitudeM / 1000]);
  const nanoteslaToMicrotesla = 1e-3;
  return {
    fieldNedMicrotesla: [point.x * nanoteslaToMicrotesla, point.y * nanoteslaToMicrotesla, point.z * nanoteslaToMicrotesla],
    fieldStrengthMicrotesla: point.f * nanoteslaToMicrotesla,
    horizontalMicrotesla: point.h * nanoteslaToMicrotesla,
    inclinationDeg: point.incl,
    declinationDeg: point.decl,
    modelName: model.name || "WMM",
    validFrom: new Date(model.start_date),
    validTo: new Date(model.end_date),
    requestedDate: date,
    evaluatedDate,
    withinValidity,
  };
}

/**
 * The instant a decimal year denotes (2027.5 → half-way through 2027), counting the
 * fraction over the calendar year's own length, as the WMM test tables do.
 */
export function dateFromDecimalYear(decimalYear: number): Date {
  const year = Math.floor(decimalYear);
  const start = Date.UTC(year, 0, 1);
  const end = Date.UTC(year + 1, 0, 1);
  return new Date(start + (decimalYear - year) * (end - start));
}
