/**
 * What the run page draws, cut down on the server from a capture of any length: a few
 * thousand points per compass (raw and corrected), time series of at most a couple of
 * thousand points, residual histograms and the current-coupling scatter. The page says how
 * many samples the capture had and how many it shows.
 *
 * Units: field µT, acceleration m/s², time s (the engine's units after conversion).
 * Corrected points are W·(raw − b) in the compass's logged frame, the frame its coverage
 * cells were counted in.
 */
import type { CaptureAnalysis } from "./analyse-capture";
import { selectKth } from "./outlier-rejection";
import type { ColumnTable, Mat3, Vec3 } from "./types";

export interface RunViewMagnetometer {
  sensor: string;
  /** Flat x,y,z triples, µT. */
  raw: number[];
  /** Flat x,y,z triples after correction, µT; null when the fit was refused. */
  corrected: number[] | null;
  hardIronOffset: Vec3 | null;
  softIronMatrix: Mat3 | null;
  fieldStrength: number | null;
  /** Samples per coverage cell (cells of sphere-cells.ts at gridResolution); null without coverage. */
  cellCounts: number[] | null;
  gridResolution: number | null;
  minSamplesPerCell: number | null;
  largestGapDeg: number | null;
  gapCentre: Vec3 | null;
  nextOrientation: string | null;
  /** Residual |corrected| − fieldStrength, µT: bin edges (one more than counts) and counts. */
  residualHistogram: { edges: number[]; counts: number[] } | null;
}

export interface RunView {
  sampleCount: number;
  /** Points per compass actually kept for the 3D view. */
  pointsShown: number;
  magnetometers: RunViewMagnetometer[];
  /** For two or more compasses: unit vectors of each, at the same instants (the first compass first). */
  pairedDirections: { sensors: string[]; directions: number[][] } | null;
  series: {
    timeS: number[];
    /** |corrected| (or |raw| when refused) per compass, µT. */
    fieldStrength: Record<string, number[]>;
    accelMagnitude: number[] | null;
    current: number[] | null;
    throttle: number[] | null;
  };
  stillPeriods: { startS: number; endS: number }[];
  poses: { face: string; startS: number; endS: number }[];
  /** Expected strength from the World Magnetic Model and the warn band around it, µT. */
  expectedField: { strength: number; low: number; high: number } | null;
  coupling: { sensor: string; input: "current" | "throttle"; x: number[]; dx: number[]; dy: number[]; dz: number[]; slope: Vec3 }[];
}

function stride(length: number, wanted: number): number {
  return Math.max(1, Math.ceil(length / Math.max(1, wanted)));
}

function round(value: number, digits = 3): number {
  const f = 10 ** digits;
  return Math.round(value * f) / f;
}

function histogram(values: Float64Array, bins: number): { edges: number[]; counts: number[] } | null {
  if (values.length === 0) return null;
  // Clip to the 0.5–99.5 percentiles so one outlier does not flatten every bar (two selections, not a sort).
  const scratch = Float64Array.from(values);
  const low = selectKth(scratch, scratch.length, Math.floor(0.005 * (scratch.length - 1)));
  const high = selectKth(scratch, scratch.length, Math.ceil(0.995 * (scratch.length - 1)));
  const span = high - low || 1e-6;
  const counts = new Array<number>(bins).fill(0);
  for (let i = 0; i < values.length; i++) {
    const k = Math.min(bins - 1, Math.max(0, Math.floor(((values[i] - low) / span) * bins)));
    counts[k] += 1;
  }
  const edges = Array.from({ length: bins + 1 }, (_, k) => round(low + (k * span) / bins, 4));
  return { edges, counts };
}

/**
 * @param capture the capture in the engine's units (convertCapture of the ingested table)
 * @param analysis the analysis of that capture
 * @param fieldBandPercent half-width of the expected-strength band, % (the warn threshold)
 */
export function buildRunView(
  capture: ColumnTable,
  analysis: CaptureAnalysis,
  options: { maxPoints?: number; maxSeriesPoints?: number; fieldBandPercent?: number } = {},
): RunView {
  const n = capture.length;
  const pointStep = stride(n, options.maxPoints ?? 4000);
  const seriesStep = stride(n, options.maxSeriesPoints ?? 1500);
  const time = capture.columns.time;

  const magnetometers: RunViewMagnetometer[] = analysis.magnetometers.map((m) => {
    const x = capture.columns[`${m.sensor}.x`];
    const y = capture.columns[`${m.sensor}.y`];
    const z = capture.columns[`${m.sensor}.z`];
    const raw: number[] = [];
    const corrected: number[] | null = m.ok ? [] : null;
    const b = m.offset ?? [0, 0, 0];
    const W = m.softIron;
    const residuals = m.ok && m.fieldStrength ? new Float64Array(n) : null;
    for (let i = 0; i < n; i++) {
      const dx = x[i] - b[0],
        dy = y[i] - b[1],
        dz = z[i] - b[2];
      let cx = 0,
        cy = 0,
        cz = 0;
      if (W) {
        cx = W[0][0] * dx + W[0][1] * dy + W[0][2] * dz;
        cy = W[1][0] * dx + W[1][1] * dy + W[1][2] * dz;
        cz = W[2][0] * dx + W[2][1] * dy + W[2][2] * dz;
        if (residuals) residuals[i] = Math.sqrt(cx * cx + cy * cy + cz * cz) - m.fieldStrength!;
      }
      if (i % pointStep === 0) {
        raw.push(round(x[i]), round(y[i]), round(z[i]));
        corrected?.push(round(cx), round(cy), round(cz));
      }
    }
    const coverage = m.calibration.coverage ?? null;
    return {
      sensor: m.sensor,
      raw,
      corrected,
      hardIronOffset: m.offset,
      softIronMatrix: m.softIron,
      fieldStrength: m.fieldStrength,
      cellCounts: coverage?.cellCounts ?? null,
      gridResolution: coverage?.gridResolution ?? null,
      minSamplesPerCell: coverage?.minSamplesPerCell ?? null,
      largestGapDeg: coverage?.largestGapDeg ?? null,
      gapCentre: coverage?.gapCentre ?? null,
      nextOrientation: coverage?.nextOrientation ?? null,
      residualHistogram: residuals ? histogram(residuals, 40) : null,
    };
  });

  // The same instants for every corrected compass, so a rotated module shows as arrows that disagree.
  const usable = magnetometers.filter((m) => m.corrected);
  let pairedDirections: RunView["pairedDirections"] = null;
  if (usable.length >= 2) {
    const count = usable[0].corrected!.length / 3;
    const every = Math.max(1, Math.floor(count / 48));
    const directions = usable.map((m) => {
      const out: number[] = [];
      for (let k = 0; k < count; k += every) {
        const [vx, vy, vz] = [m.corrected![3 * k], m.corrected![3 * k + 1], m.corrected![3 * k + 2]];
        const norm = Math.hypot(vx, vy, vz) || 1;
        out.push(round(vx / norm, 4), round(vy / norm, 4), round(vz / norm, 4));
      }
      return out;
    });
    pairedDirections = { sensors: usable.map((m) => m.sensor), directions };
  }

  const timeS: number[] = [];
  const fieldStrength: Record<string, number[]> = Object.fromEntries(magnetometers.map((m) => [m.sensor, []]));
  const accel = capture.columns["accel_a.x"] ? ["x", "y", "z"].map((a) => capture.columns[`accel_a.${a}`]) : null;
  const accelMagnitude: number[] | null = accel ? [] : null;
  const current = capture.columns.current ? ([] as number[]) : null;
  const throttle = capture.columns.throttle ? ([] as number[]) : null;
  for (let i = 0; i < n; i += seriesStep) {
    timeS.push(round(time ? time[i] : i));
    for (const m of analysis.magnetometers) {
      const x = capture.columns[`${m.sensor}.x`][i],
        y = capture.columns[`${m.sensor}.y`][i],
        z = capture.columns[`${m.sensor}.z`][i];
      const b = m.offset ?? [0, 0, 0];
      const W = m.softIron;
      const v = W
        ? [
            W[0][0] * (x - b[0]) + W[0][1] * (y - b[1]) + W[0][2] * (z - b[2]),
            W[1][0] * (x - b[0]) + W[1][1] * (y - b[1]) + W[1][2] * (z - b[2]),
            W[2][0] * (x - b[0]) + W[2][1] * (y - b[1]) + W[2][2] * (z - b[2]),
          ]
        : [x, y, z];
      fieldStrength[m.sensor].push(round(Math.hypot(v[0], v[1], v[2])));
    }
    if (accel && accelMagnitude) accelMagnitude.push(round(Math.hypot(accel[0][i], accel[1][i], accel[2][i])));
    current?.push(round(capture.columns.current[i]));
    throttle?.push(round(capture.columns.throttle[i]));
  }

  const reference = analysis.reference.magnetic;
  const band = options.fieldBandPercent ?? 10;
  const expectedField = reference
    ? {
        strength: round(reference.fieldStrengthMicrotesla),
        low: round(reference.fieldStrengthMicrotesla * (1 - band / 100)),
        high: round(reference.fieldStrengthMicrotesla * (1 + band / 100)),
      }
    : null;

  const coupling: RunView["coupling"] = [];
  for (const m of analysis.magnetometers) {
    const result = m.currentCoupling;
    if (!result || !m.ok) continue;
    const input = capture.columns[result.kind];
    const x: number[] = [];
    const d: number[][] = [[], [], []];
    const b = m.offset!;
    const W = m.softIron!;
    // Field change against the input, within the still stretches where the motors ran (the
    // attitude fixed), relative to the level the fitted slope implies at zero input.
    const inRun = new Uint8Array(n);
    for (const p of analysis.stillPeriods) {
      let powered = false;
      for (let i = p.startIndex; i < p.endIndex && !powered; i++) powered = input[i] > 0;
      if (powered) inRun.fill(1, p.startIndex, p.endIndex);
    }
    const off = [0, 0, 0];
    let count = 0;
    let inputMean = 0;
    for (let i = 0; i < n; i++) {
      if (!inRun[i]) continue;
      const v = [
        capture.columns[`${m.sensor}.x`][i] - b[0],
        capture.columns[`${m.sensor}.y`][i] - b[1],
        capture.columns[`${m.sensor}.z`][i] - b[2],
      ];
      for (let r = 0; r < 3; r++) off[r] += W[r][0] * v[0] + W[r][1] * v[1] + W[r][2] * v[2];
      inputMean += input[i];
      count += 1;
    }
    if (count === 0) continue;
    inputMean /= count;
    for (let r = 0; r < 3; r++) off[r] = off[r] / count - result.slopePerUnit[r] * inputMean;
    const step = stride(n, 800);
    for (let i = 0; i < n; i += step) {
      if (!inRun[i]) continue;
      const v = [
        capture.columns[`${m.sensor}.x`][i] - b[0],
        capture.columns[`${m.sensor}.y`][i] - b[1],
        capture.columns[`${m.sensor}.z`][i] - b[2],
      ];
      x.push(round(input[i]));
      for (let r = 0; r < 3; r++) d[r].push(round(W[r][0] * v[0] + W[r][1] * v[1] + W[r][2] * v[2] - off[r]));
    }
    coupling.push({ sensor: m.sensor, input: result.kind, x, dx: d[0], dy: d[1], dz: d[2], slope: result.slopePerUnit });
  }

  return {
    sampleCount: n,
    pointsShown: Math.ceil(n / pointStep),
    magnetometers,
    pairedDirections,
    series: { timeS, fieldStrength, accelMagnitude, current, throttle },
    stillPeriods: analysis.stillPeriods.map((p) => ({ startS: round(p.startTimeS), endS: round(p.endTimeS) })),
    poses: (analysis.accelerometer?.poses ?? []).map((p) => ({ face: p.face, startS: round(p.startTimeS), endS: round(p.endTimeS) })),
    expectedField,
    coupling,
  };
}
