/**
 * Interval-width benchmark: are the 95% offset intervals as wide with the fast fit (a
 * well-spread subsample, then polishing on every sample; each bootstrap resample gathered
 * into contiguous buffers; on a capture of ASYMPTOTIC_INTERVAL_MIN_SAMPLES or more the
 * sandwich covariance instead of the bootstrap) as with the every-sample method
 * (`{ subsample: false }`, 200 bootstrap resamples refitted through indices)? Run alone with `npx tsx bench/interval-bench.ts`, or call
 * `benchIntervalWidths()`.
 *
 * Captures: compass A of the demo fleet's simulated captures (the specs of lib/seed/demo-runs.ts,
 * which the seed also reads, here with the simulator's default site field), and one long capture:
 * a 100 Hz simulated tumble repeated to 1,000,000 samples with fresh noise on every copy
 * (invented data). For each, outlier rejection and the model choice run once (as
 * calibrateMagnetometer does them), then both methods fit the chosen model to the kept
 * samples and bootstrap its intervals with the same seed.
 */
import path from "node:path";
import { ASYMPTOTIC_INTERVAL_MIN_SAMPLES, asymptoticIntervals } from "@/geometry/asymptotic-intervals";
import { bootstrapIntervals } from "@/geometry/bootstrap";
import { ellipsoidScales } from "@/geometry/ellipsoid-fit";
import { chooseMagModel, fitMagModel } from "@/geometry/magnetometer-models";
import type { CaptureSpec } from "@/geometry/magnetometer-types";
import { fitWithOutlierRejection } from "@/geometry/outlier-rejection";
import { createRandom } from "@/geometry/random";
import { simulateCapture } from "@/geometry/simulator";
import type { Vec3Series } from "@/geometry/types";
import { DEMO_RUNS } from "@/lib/seed/demo-runs";

/** Compass A of each demo run, from the seed's own list (lib/seed/demo-runs.ts). */
const DEMO_SPECS: { label: string; spec: CaptureSpec }[] = DEMO_RUNS.map((run, i) => ({
  label: `demo ${i + 1}, ${run.vehicle}`,
  spec: run.spec,
}));

function compassA(spec: CaptureSpec): Vec3Series {
  const { columns } = simulateCapture(spec).table;
  return { x: columns["compass_a.x"], y: columns["compass_a.y"], z: columns["compass_a.z"] };
}

/** A 100 Hz tumble repeated to `n` samples, each copy with fresh 0.2 µT noise. */
function longCapture(n: number): Vec3Series {
  const base = compassA({
    seed: 1,
    sampleRateHz: 100,
    pathSeconds: 60,
    accelerometer: false,
    gyro: false,
    magnetometers: [{ hardIronOffset: [12, -5, 20], softIron: "mild", noise: 0.2 }],
  });
  const random = createRandom(2);
  const out: Vec3Series = { x: new Float64Array(n), y: new Float64Array(n), z: new Float64Array(n) };
  for (let i = 0; i < n; i++) {
    const k = i % base.x.length;
    out.x[i] = base.x[k] + random.gaussian(0, 0.2);
    out.y[i] = base.y[k] + random.gaussian(0, 0.2);
    out.z[i] = base.z[k] + random.gaussian(0, 0.2);
  }
  return out;
}

export interface IntervalComparison {
  label: string;
  samples: number;
  model: string;
  /** Width of the 95% offset interval per axis, every-sample method and fast method. */
  fullWidths: number[];
  fastWidths: number[];
  /** fast / full per axis. */
  ratios: number[];
  /** Largest |fast − full| offset difference, as a fraction of that axis's interval width. */
  offsetShiftOfWidth: number;
  /** Where the fast method's intervals came from. */
  fastMethod: string;
  /** Seconds for fit + intervals. */
  fullSeconds: number;
  fastSeconds: number;
}

function compare(label: string, series: Vec3Series): IntervalComparison | string {
  const eligible = new Uint8Array(series.x.length);
  for (let i = 0; i < eligible.length; i++) eligible[i] = Number.isFinite(series.x[i] + series.y[i] + series.z[i]) ? 1 : 0;
  const robust = fitWithOutlierRejection(series, "full", eligible);
  if (!robust.ok) return `${label}: no fit (${robust.detail}).`;
  const inliers = robust.robust.inliers;
  const chosen = chooseMagModel(series, "auto", { mask: inliers }, [robust.robust.fit]);
  if (!chosen.ok) return `${label}: no model (${chosen.detail}).`;
  const model = chosen.choice.chosen.estimate.model;
  const run = (fast: boolean) => {
    const started = performance.now();
    const fit = fitMagModel(series, model, { mask: inliers }, { subsample: fast });
    if (!fit.ok) throw new Error(`${label}: ${fit.detail}`);
    const e = fit.fit.estimate;
    // As calibrateMagnetometer chooses: the sandwich covariance for a long capture, else the bootstrap.
    const sandwich = fast && fit.fit.samples >= ASYMPTOTIC_INTERVAL_MIN_SAMPLES ? asymptoticIntervals(series, e, inliers) : null;
    const intervals =
      sandwich ??
      bootstrapIntervals(
        series,
        model,
        inliers,
        { offset: e.hardIronOffset, scales: ellipsoidScales(e.softIronMatrix), start: e },
        { gather: fast },
      );
    return {
      offset: e.hardIronOffset,
      widths: intervals.offsetInterval95.map((i) => i.high - i.low),
      method: sandwich ? "sandwich" : "bootstrap",
      seconds: (performance.now() - started) / 1000,
    };
  };
  // The every-sample method first and last, so that neither method alone runs on a cold JIT.
  run(false);
  const fast = run(true);
  const full = run(false);
  return {
    label,
    samples: series.x.length,
    model,
    fullWidths: full.widths,
    fastWidths: fast.widths,
    ratios: fast.widths.map((w, a) => w / full.widths[a]),
    offsetShiftOfWidth: Math.max(...fast.offset.map((v, a) => Math.abs(v - full.offset[a]) / full.widths[a])),
    fastMethod: fast.method,
    fullSeconds: full.seconds,
    fastSeconds: fast.seconds,
  };
}

const pad = (text: string, width: number) => (text.length >= width ? text : " ".repeat(width - text.length) + text);
const triple = (values: number[], digits: number) => values.map((v) => v.toFixed(digits)).join(" ");

/**
 * Prints, per capture, the 95% offset interval widths (µT, x y z) of both methods, their
 * ratio, how far apart the two offsets are as a fraction of the width, and the seconds each
 * method took for fit plus bootstrap; returns the rows.
 */
export function benchIntervalWidths(options: { longSamples?: number } = {}): IntervalComparison[] {
  const captures: { label: string; series: () => Vec3Series }[] = [
    ...DEMO_SPECS.map(({ label, spec }) => ({ label, series: () => compassA(spec) })),
    { label: "long tumble", series: () => longCapture(options.longSamples ?? 1_000_000) },
  ];
  process.stdout.write(`95% offset interval widths, every-sample method (full) against the fast one (node ${process.version}):\n`);
  process.stdout.write(
    `${pad("capture", 22)} ${pad("samples", 10)} ${pad("model", 6)} ${pad("full widths µT", 20)} ${pad("fast widths µT", 20)} ${pad("fast/full", 20)} ${pad("shift/width", 11)} ${pad("full s", 7)} ${pad("fast s", 7)} fast intervals\n`,
  );
  const rows: IntervalComparison[] = [];
  for (const capture of captures) {
    const row = compare(capture.label, capture.series());
    if (typeof row === "string") {
      process.stdout.write(`${row}\n`);
      continue;
    }
    rows.push(row);
    process.stdout.write(
      `${pad(row.label, 22)} ${pad(row.samples.toLocaleString("en-GB"), 10)} ${pad(row.model, 6)} ${pad(triple(row.fullWidths, 4), 20)} ${pad(triple(row.fastWidths, 4), 20)} ${pad(triple(row.ratios, 4), 20)} ${pad(row.offsetShiftOfWidth.toExponential(1), 11)} ${pad(row.fullSeconds.toFixed(3), 7)} ${pad(row.fastSeconds.toFixed(3), 7)} ${row.fastMethod}\n`,
    );
  }
  return rows;
}

if (path.basename(process.argv[1] ?? "").startsWith("interval-bench")) benchIntervalWidths();
