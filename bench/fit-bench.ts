/**
 * Ellipsoid-fit benchmark: samples per second and peak memory for 10k, 100k and 1M samples.
 * Run alone with `npx tsx bench/fit-bench.ts`, or through `npm run bench` (bench/run.ts calls
 * `benchEllipsoidFit()`).
 *
 * Steps, each measured in a fresh child process so that its peak resident memory (the
 * kernel's maxRSS) is its own; "above data" is that peak minus the peak of a child that
 * only builds the samples. Each step is timed three times after a warm-up and the fastest
 * run gives samples/s (the median is shown beside it), since other work on the machine can
 * only slow a run down; "cpu s" is the CPU time of that run over all of Node's threads
 * (the garbage collector and compiler work in the background), a steadier figure when the
 * machine is busy:
 * - algebraic: the one-pass normal equations and the constrained fit (full model);
 * - fit: algebraic fit plus geometric refinement (full model) — the figure the "1,000,000
 *   samples well under a second" goal is about; on long captures both work on a well-spread
 *   subsample first and then polish on every sample;
 * - fit, every sample: the same with `{ subsample: false }`, every iteration on every sample
 *   (the reference the fast path is checked against);
 * - fit, cold: the same without first running it on another capture, so the time includes
 *   the JIT compiling the hot loops;
 * - bootstrap: the 200 resamples of the 95% intervals alone, from a fit made beforehand;
 * - calibrate: the whole calibrateMagnetometer (support check, outlier rejection, three
 *   models, saturation, coverage) without and with the bootstrap.
 * Samples: an ellipsoid with strong soft iron, 48 µT field, 0.5 µT noise, directions uniform
 * on the sphere (invented data).
 */
import { spawnSync } from "node:child_process";
import path from "node:path";
import { calibrateMagnetometer } from "@/geometry/calibrate-magnetometer";
import { bootstrapIntervals } from "@/geometry/bootstrap";
import { ellipsoidScales, fitEllipsoidAlgebraic } from "@/geometry/ellipsoid-fit";
import { fitMagModel, type ModelFit } from "@/geometry/magnetometer-models";
import { createRandom } from "@/geometry/random";
import type { Vec3Series } from "@/geometry/types";

const SIZES = [10_000, 100_000, 1_000_000];
const STEPS = ["data", "algebraic", "fit", "fit-every-sample", "fit-cold", "bootstrap", "calibrate-no-bootstrap", "calibrate"] as const;
type Step = (typeof STEPS)[number];
const LABELS: Record<Step, string> = {
  data: "data only",
  algebraic: "algebraic",
  fit: "fit",
  "fit-every-sample": "fit, every sample",
  "fit-cold": "fit, cold",
  bootstrap: "bootstrap",
  "calibrate-no-bootstrap": "calibrate, no bootstrap",
  calibrate: "calibrate",
};

interface Measurement {
  step: Step;
  samples: number;
  /** Wall-clock seconds of the fastest timed run, and the median. */
  seconds: number;
  medianSeconds: number;
  /** CPU seconds (user + system, all threads) of the fastest run. */
  cpuSeconds: number;
  peakRssMiB: number;
}

/** Timed runs per step: the fastest is the best estimate of the cost on a busy machine. */
const REPEATS = 3;

function samples(n: number, seed = 1): Vec3Series {
  const random = createRandom(seed);
  const s = [
    [1.18, 0.06, -0.04],
    [0.06, 0.86, 0.08],
    [-0.04, 0.08, 1.05],
  ];
  const out: Vec3Series = { x: new Float64Array(n), y: new Float64Array(n), z: new Float64Array(n) };
  for (let i = 0; i < n; i++) {
    const gx = random.gaussian();
    const gy = random.gaussian();
    const gz = random.gaussian();
    const k = 48 / Math.hypot(gx, gy, gz);
    const u = [gx * k, gy * k, gz * k];
    out.x[i] = s[0][0] * u[0] + s[0][1] * u[1] + s[0][2] * u[2] + 30 + random.gaussian(0, 0.5);
    out.y[i] = s[1][0] * u[0] + s[1][1] * u[1] + s[1][2] * u[2] - 12 + random.gaussian(0, 0.5);
    out.z[i] = s[2][0] * u[0] + s[2][1] * u[1] + s[2][2] * u[2] + 55 + random.gaussian(0, 0.5);
  }
  return out;
}

/** The full-model fit the bootstrap step starts from, made once per series outside the timing. */
const fits = new WeakMap<Vec3Series, ModelFit>();
function fittedFor(series: Vec3Series): ModelFit {
  let fit = fits.get(series);
  if (!fit) {
    const result = fitMagModel(series, "full");
    if (!result.ok) throw new Error("fit failed");
    fit = result.fit;
    fits.set(series, fit);
  }
  return fit;
}
const allKept = (series: Vec3Series) => new Uint8Array(series.x.length).fill(1);

function runStep(step: Step, series: Vec3Series): void {
  if (step === "algebraic") {
    if (!fitEllipsoidAlgebraic(series, "full").ok) throw new Error("algebraic fit failed");
  } else if (step === "fit" || step === "fit-cold") {
    if (!fitMagModel(series, "full").ok) throw new Error("fit failed");
  } else if (step === "fit-every-sample") {
    if (!fitMagModel(series, "full", {}, { subsample: false }).ok) throw new Error("fit failed");
  } else if (step === "bootstrap") {
    const fit = fittedFor(series);
    const e = fit.estimate;
    bootstrapIntervals(series, "full", allKept(series), { offset: e.hardIronOffset, scales: ellipsoidScales(e.softIronMatrix), start: e });
  } else if (step === "calibrate" || step === "calibrate-no-bootstrap") {
    if (!calibrateMagnetometer(series, { bootstrap: step === "calibrate" }).ok) throw new Error("calibration refused");
  }
}

/**
 * Child: build the samples, warm up on another set of up to 100,000 (except the cold step, so
 * that the compiled code has seen the long-capture paths too), then time REPEATS runs (one
 * for the cold step).
 */
function measure(step: Step, n: number): Measurement {
  const cold = step === "fit-cold";
  if (!cold && step !== "data") runStep(step, samples(Math.min(n, 100_000), 2));
  const series = samples(n);
  if (step === "bootstrap") fittedFor(series);
  const runs: { wall: number; cpu: number }[] = [];
  for (let r = 0; r < (cold || step === "data" ? 1 : REPEATS); r++) {
    const cpuStart = process.cpuUsage();
    const start = performance.now();
    runStep(step, series);
    const wall = (performance.now() - start) / 1000;
    const cpu = process.cpuUsage(cpuStart);
    runs.push({ wall, cpu: (cpu.user + cpu.system) / 1e6 });
  }
  runs.sort((a, b) => a.wall - b.wall);
  return {
    step,
    samples: n,
    seconds: runs[0].wall,
    medianSeconds: runs[Math.floor(runs.length / 2)].wall,
    cpuSeconds: runs[0].cpu,
    peakRssMiB: process.resourceUsage().maxRSS / 1024,
  };
}

function thisFile(): string {
  // Run alone, argv[1] is this file; imported by bench/run.ts, it is that file beside this one.
  const invoked = process.argv[1] ?? "";
  return path.basename(invoked).startsWith("fit-bench") ? invoked : path.resolve(path.dirname(invoked), "fit-bench.ts");
}

function runChild(step: Step, n: number): Measurement {
  const child = spawnSync(process.execPath, ["--import", "tsx", thisFile(), "--fit-child", step, String(n)], {
    encoding: "utf8",
    maxBuffer: 1 << 20,
  });
  if (child.status !== 0) throw new Error(`fit bench step ${step} on ${n} samples failed:\n${child.stderr}`);
  return JSON.parse(child.stdout) as Measurement;
}

const pad = (text: string, width: number) => (text.length >= width ? text : " ".repeat(width - text.length) + text);

const COLUMNS: [string, number][] = [
  ["step", 24],
  ["samples", 10],
  ["best s", 8],
  ["median s", 9],
  ["cpu s", 7],
  ["samples/s", 12],
  ["peak MiB", 9],
  ["above data", 11],
];

function row(cells: string[]): string {
  return cells.map((cell, i) => pad(cell, COLUMNS[i][1])).join(" ") + "\n";
}

/** Prints the table of samples/s and peak memory per step and size; returns nothing. */
export function benchEllipsoidFit(): void {
  process.stdout.write(
    `node ${process.version}, one core, each row a fresh process; fastest and median of ${REPEATS} runs after a warm-up\n`,
  );
  process.stdout.write(row(COLUMNS.map(([title]) => title)));
  for (const n of SIZES) {
    const data = runChild("data", n);
    for (const step of STEPS) {
      const m = step === "data" ? data : runChild(step, n);
      const timed = step !== "data";
      process.stdout.write(
        row([
          LABELS[step],
          n.toLocaleString("en-GB"),
          timed ? m.seconds.toFixed(3) : "",
          timed ? m.medianSeconds.toFixed(3) : "",
          timed ? m.cpuSeconds.toFixed(3) : "",
          timed ? Math.round(n / m.seconds).toLocaleString("en-GB") : "",
          m.peakRssMiB.toFixed(0),
          timed ? (m.peakRssMiB - data.peakRssMiB).toFixed(0) : "",
        ]),
      );
    }
  }
}

const childAt = process.argv.indexOf("--fit-child");
if (childAt >= 0) {
  process.stdout.write(JSON.stringify(measure(process.argv[childAt + 1] as Step, Number(process.argv[childAt + 2]))));
} else if (path.basename(process.argv[1] ?? "").startsWith("fit-bench")) {
  benchEllipsoidFit();
}
