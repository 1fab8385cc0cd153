/**
 * The weakest and strongest main field the World Magnetic Model gives anywhere on or near the
 * Earth's surface over the model's whole validity, and the plausible-field limits drawn from
 * them. Computed from the model (the `geomagnetism` package's WMM2025 coefficients) once,
 * lazily, by a coarse grid search refined around the extremes.
 */
import * as geomagnetism from "geomagnetism";

/** WMM2025's published validity, decimal years (NOAA/NCEI and BGS, WMM2025 report). */
export const FIELD_BAND_YEARS = { from: 2025.0, to: 2030.0 } as const;

/**
 * Heights above the ellipsoid the band covers, metres. Engineering choice: from below the
 * lowest dry land (about 430 m below sea level) to above the ceiling of small uncrewed
 * vehicles, with room to spare at both ends.
 */
export const FIELD_BAND_ALTITUDE_M = { lowest: -500, highest: 10_000 } as const;

/** Spacing of the first grid, degrees; the field's smallest features span tens of degrees (engineering choice). */
export const FIELD_BAND_COARSE_STEP_DEG = 10;

/** The refinement stops when its step is below this, degrees (about ten kilometres; at an extreme the field is flat, so the strength found is within a few nT of the true one: engineering choice). */
export const FIELD_BAND_FINE_STEP_DEG = 0.1;

/** How many separate coarse candidates are refined for each extreme (engineering choice). */
export const FIELD_BAND_CANDIDATES = 4;

/**
 * The plausible-field limits lie this fraction outside the model's extremes. Engineering
 * choice: as wide as the 10% sensitivity allowance of the field-against-model check, so a
 * capture that passes that check at the model's weakest or strongest spot passes here too;
 * crustal fields (a few hundred nT, rarely more) fit well inside.
 */
export const PLAUSIBLE_FIELD_MARGIN_FRACTION = 0.1;

export interface FieldExtreme {
  strengthMicrotesla: number;
  latitudeDeg: number;
  longitudeDeg: number;
  altitudeM: number;
  /** When in the window the extreme falls, decimal year. */
  decimalYear: number;
}

export interface ModelFieldBand {
  modelName: string;
  fromYear: number;
  toYear: number;
  lowestAltitudeM: number;
  highestAltitudeM: number;
  weakest: FieldExtreme;
  strongest: FieldExtreme;
}

type Vec = [number, number, number];

/**
 * The model's field (nT, north-east-down) at a site, as a line in time: B(s) = start + s · change
 * for s from 0 (FIELD_BAND_YEARS.from) to 1 (FIELD_BAND_YEARS.to). The model's coefficients move
 * linearly in time, so the field does too; two evaluations inside the package's dates give the
 * line exactly, and it may be followed to the published end of validity (2030.0), which lies
 * past the last date the package accepts.
 */
interface FieldLine {
  at(latitudeDeg: number, longitudeDeg: number, altitudeM: number): { start: Vec; change: Vec };
  modelName: string;
}

function fieldLine(): FieldLine {
  const firstYear = FIELD_BAND_YEARS.from;
  const secondYear = FIELD_BAND_YEARS.from + 4;
  // 1 January of each year: the package counts the year's fraction from there.
  const first = geomagnetism.model(new Date(Date.UTC(firstYear, 0, 1)));
  const second = geomagnetism.model(new Date(Date.UTC(secondYear, 0, 1)));
  const stretch = (FIELD_BAND_YEARS.to - FIELD_BAND_YEARS.from) / (secondYear - firstYear);
  return {
    modelName: first.name || "WMM",
    at(latitudeDeg, longitudeDeg, altitudeM) {
      const a = first.point([latitudeDeg, longitudeDeg, altitudeM / 1000]);
      const b = second.point([latitudeDeg, longitudeDeg, altitudeM / 1000]);
      return {
        start: [a.x, a.y, a.z],
        change: [(b.x - a.x) * stretch, (b.y - a.y) * stretch, (b.z - a.z) * stretch],
      };
    },
  };
}

const dot = (a: Vec, b: Vec) => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
const along = (start: Vec, change: Vec, s: number) =>
  Math.hypot(start[0] + s * change[0], start[1] + s * change[1], start[2] + s * change[2]);

/** The weakest field over the window at a site, nT, and when (|B(s)| is convex in s, so its minimum has a closed form). */
function weakestInTime(line: { start: Vec; change: Vec }): { nT: number; s: number } {
  const { start, change } = line;
  const squared = dot(change, change);
  const s = squared > 0 ? Math.min(1, Math.max(0, -dot(start, change) / squared)) : 0;
  return { nT: along(start, change, s), s };
}

/** The strongest field over the window at a site, nT, and when (a convex function peaks at an end). */
function strongestInTime(line: { start: Vec; change: Vec }): { nT: number; s: number } {
  const atStart = along(line.start, line.change, 0);
  const atEnd = along(line.start, line.change, 1);
  return atEnd > atStart ? { nT: atEnd, s: 1 } : { nT: atStart, s: 0 };
}

interface Probe {
  /** Larger is better (the search maximises). */
  score: number;
  latitudeDeg: number;
  longitudeDeg: number;
  s: number;
}

const wrapLongitude = (deg: number) => ((((deg + 180) % 360) + 360) % 360) - 180;

/**
 * Maximises `value` over the globe: a coarse grid, then a compass search from the best few
 * grid points that lie well apart, halving the step until it is fine.
 */
function searchGlobe(value: (latitudeDeg: number, longitudeDeg: number) => { score: number; s: number }): Probe {
  const step = FIELD_BAND_COARSE_STEP_DEG;
  const grid: Probe[] = [];
  for (let lat = -90; lat <= 90; lat += step) {
    for (let lon = -180; lon < 180; lon += step) grid.push({ ...value(lat, lon), latitudeDeg: lat, longitudeDeg: lon });
  }
  grid.sort((a, b) => b.score - a.score);
  const starts: Probe[] = [];
  for (const probe of grid) {
    if (starts.length >= FIELD_BAND_CANDIDATES) break;
    const apart = starts.every(
      (other) =>
        Math.abs(other.latitudeDeg - probe.latitudeDeg) > 3 * step ||
        Math.abs(wrapLongitude(other.longitudeDeg - probe.longitudeDeg)) > 3 * step,
    );
    if (apart) starts.push(probe);
  }
  let best = starts[0];
  for (const start of starts) {
    let here = start;
    for (let delta = step / 2; delta >= FIELD_BAND_FINE_STEP_DEG;) {
      let moved = false;
      for (const [dLat, dLon] of [
        [1, 0],
        [-1, 0],
        [0, 1],
        [0, -1],
        [1, 1],
        [1, -1],
        [-1, 1],
        [-1, -1],
      ]) {
        const lat = Math.max(-90, Math.min(90, here.latitudeDeg + dLat * delta));
        const lon = wrapLongitude(here.longitudeDeg + dLon * delta);
        const probe = { ...value(lat, lon), latitudeDeg: lat, longitudeDeg: lon };
        if (probe.score > here.score) {
          here = probe;
          moved = true;
        }
      }
      if (!moved) delta /= 2;
    }
    if (here.score > best.score) best = here;
  }
  return best;
}

/**
 * Finds the model's weakest and strongest field over its validity and the altitude band.
 * The weakest lies at the top of the band (the field weakens with height), the strongest at
 * its bottom; in time the field moves along a straight line, so both are exact over the window.
 */
export function computeModelFieldBand(): ModelFieldBand {
  const line = fieldLine();
  const { lowest, highest } = FIELD_BAND_ALTITUDE_M;
  const span = FIELD_BAND_YEARS.to - FIELD_BAND_YEARS.from;
  const weak = searchGlobe((lat, lon) => {
    const found = weakestInTime(line.at(lat, lon, highest));
    return { score: -found.nT, s: found.s };
  });
  const strong = searchGlobe((lat, lon) => {
    const found = strongestInTime(line.at(lat, lon, lowest));
    return { score: found.nT, s: found.s };
  });
  const extreme = (probe: Probe, nT: number, altitudeM: number): FieldExtreme => ({
    strengthMicrotesla: nT / 1000,
    latitudeDeg: probe.latitudeDeg,
    longitudeDeg: probe.longitudeDeg,
    altitudeM,
    decimalYear: FIELD_BAND_YEARS.from + probe.s * span,
  });
  return {
    modelName: line.modelName,
    fromYear: FIELD_BAND_YEARS.from,
    toYear: FIELD_BAND_YEARS.to,
    lowestAltitudeM: lowest,
    highestAltitudeM: highest,
    weakest: extreme(weak, -weak.score, highest),
    strongest: extreme(strong, strong.score, lowest),
  };
}

let cachedBand: ModelFieldBand | null = null;

/** The model's field band, computed on first use (well under a second) and kept. */
export function modelFieldBand(): ModelFieldBand {
  cachedBand ??= computeModelFieldBand();
  return cachedBand;
}

/** The model's field strength at a site and decimal year in the window, µT (for checking the band). */
export function modelFieldStrengthAt(latitudeDeg: number, longitudeDeg: number, altitudeM: number, decimalYear: number): number {
  const s = (decimalYear - FIELD_BAND_YEARS.from) / (FIELD_BAND_YEARS.to - FIELD_BAND_YEARS.from);
  if (!(s >= 0 && s <= 1)) throw new RangeError(`year ${decimalYear} is outside ${FIELD_BAND_YEARS.from}–${FIELD_BAND_YEARS.to}`);
  const { start, change } = fieldLine().at(latitudeDeg, longitudeDeg, altitudeM);
  return along(start, change, s) / 1000;
}

/** The plausible-field warning limits, µT: the model's band widened by the margin, rounded outwards to 0.1 µT. */
export function plausibleFieldLimits(): { warnBelow: number; warnAbove: number } {
  const band = modelFieldBand();
  return {
    warnBelow: Math.floor(band.weakest.strengthMicrotesla * (1 - PLAUSIBLE_FIELD_MARGIN_FRACTION) * 10) / 10,
    warnAbove: Math.ceil(band.strongest.strengthMicrotesla * (1 + PLAUSIBLE_FIELD_MARGIN_FRACTION) * 10) / 10,
  };
}
