/**
 * Benchmarks of the calibration engine: `npm run bench`.
 *
 * Prints samples per second and peak memory for reading a CSV file as a stream (also with
 * the JavaScript heap capped at 64 MiB, which only a bounded read survives), for
 * still-period detection and for the whole `analyseCapture` on 10k, 100k and 1M samples,
 * after the ellipsoid-fit figures of bench/fit-bench.ts when that module exists.
 *
 * Each measurement runs in a fresh child process, so that its peak resident memory (the
 * kernel's maxRSS) belongs to it alone; "data only" is the same child building the capture
 * and doing nothing else, and the extra memory a step needs is its peak above that (for
 * streamed reading, above a child that loads the code and builds nothing). Every
 * child first runs its step once on one copy of the recording, so that the timing is of
 * compiled code rather than of the JIT warming up.
 * Captures are a simulated 102 s recording at 100 Hz (six accelerometer holds, then a full
 * tumble; two compasses, one with mild soft iron), repeated end to end to the length wanted.
 * Then: the 95% interval widths of the fast fit against the every-sample method
 * (interval-bench.ts), `npm run fit` against a numpy script on a 1M-sample file (cli-bench.ts),
 * the whole upload-to-result flow with the worker's peak memory (e2e-bench.ts) and a class
 * session with 60 viewers (class-bench.ts).
 */
import { spawnSync } from "node:child_process";
import { createReadStream, existsSync, mkdirSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { analyseCapture } from "@/geometry/analyse-capture";
import type { BodyFace } from "@/geometry/magnetometer-types";
import { simulateCapture, tableToCsv } from "@/geometry/simulator";
import { findStillPeriods } from "@/geometry/still-periods";
import type { ColumnTable } from "@/geometry/types";
import { parseCsvStream } from "@/lib/ingest/csv-table";

const SIZES = [10_000, 100_000, 1_000_000];
const STEPS = ["start-up", "data", "ingest-stream", "ingest-64MiB-heap", "still", "analyse", "analyse-no-bootstrap"] as const;
type Step = (typeof STEPS)[number];

interface Measurement {
  step: Step;
  samples: number;
  seconds: number;
  peakRssMiB: number;
}

function capture(samples: number): ColumnTable {
  const faces: BodyFace[] = ["+z", "-z", "+x", "-x", "+y", "-y"];
  const base = simulateCapture({
    seed: 1,
    sampleRateHz: 100,
    holds: { faces },
    pathSeconds: 60,
    magnetometers: [{ hardIronOffset: [12, -5, 20], softIron: "mild" }, { hardIronOffset: [3, 4, -6] }],
  }).table;
  const columns: Record<string, Float64Array> = {};
  for (const field of base.fields) columns[field] = new Float64Array(samples);
  const span = base.columns.time[base.length - 1] + 0.01;
  for (const field of base.fields) {
    const source = base.columns[field];
    const target = columns[field];
    for (let i = 0; i < samples; i++) {
      const k = i % base.length;
      target[i] = field === "time" ? source[k] + Math.floor(i / base.length) * span : source[k];
    }
  }
  return { fields: [...base.fields], columns, length: samples };
}

const OUT = path.resolve(path.dirname(process.argv[1]), "out");

/** The capture as a CSV file in bench/out (git-ignored), written once per size. */
function csvFile(samples: number): string {
  const file = path.join(OUT, `capture-${samples}.csv`);
  if (existsSync(file) && statSync(file).size > 0) return file;
  mkdirSync(OUT, { recursive: true });
  writeFileSync(file, tableToCsv(capture(samples)));
  return file;
}

async function runStep(step: Step, table: ColumnTable): Promise<void> {
  if (step === "ingest-stream" || step === "ingest-64MiB-heap") {
    await parseCsvStream(createReadStream(csvFile(table.length)));
  } else if (step === "still") {
    const c = table.columns;
    findStillPeriods(
      c.time,
      { x: c["accel_a.x"], y: c["accel_a.y"], z: c["accel_a.z"] },
      { gyro: { x: c["gyro_a.x"], y: c["gyro_a.y"], z: c["gyro_a.z"] } },
    );
  } else if (step === "analyse" || step === "analyse-no-bootstrap") {
    analyseCapture(table, { units: { magnetic: { kind: "magnetic", unit: "uT" } }, bootstrap: step === "analyse" });
  }
}

/** Child: one step on one size, after a warm-up on a short capture; prints a Measurement as JSON. */
async function measure(step: Step, samples: number): Promise<void> {
  if (step !== "start-up") await runStep(step, capture(10_200));
  // Streaming reads its file, so it need not hold the capture in memory beforehand.
  const table = step.startsWith("ingest") || step === "start-up" ? { fields: [], columns: {}, length: samples } : capture(samples);
  const start = performance.now();
  await runStep(step, table);
  const seconds = (performance.now() - start) / 1000;
  const result: Measurement = { step, samples, seconds, peakRssMiB: process.resourceUsage().maxRSS / 1024 };
  process.stdout.write(JSON.stringify(result));
}

function runChild(step: Step, samples: number): Measurement {
  // The capped run proves the streamed read keeps the JavaScript heap small: it would die
  // with "heap out of memory" if it held the file's text or its rows.
  const heapCap = step === "ingest-64MiB-heap" ? ["--max-old-space-size=64"] : [];
  const child = spawnSync(process.execPath, [...heapCap, "--import", "tsx", process.argv[1], "--child", step, String(samples)], {
    encoding: "utf8",
    maxBuffer: 1 << 20,
  });
  if (child.status !== 0) throw new Error(`bench step ${step} on ${samples} samples failed:\n${child.stderr}`);
  return JSON.parse(child.stdout) as Measurement;
}

function pad(text: string, width: number): string {
  return text.length >= width ? text : " ".repeat(width - text.length) + text;
}

async function runEllipsoidBench(): Promise<void> {
  const file = path.resolve(path.dirname(process.argv[1]), "fit-bench.ts");
  if (!existsSync(file)) {
    process.stdout.write("Ellipsoid fit: bench/fit-bench.ts not present, skipped.\n\n");
    return;
  }
  const fitBench = (await import(pathToFileURL(file).href)) as { benchEllipsoidFit?: () => unknown };
  if (typeof fitBench.benchEllipsoidFit !== "function") {
    process.stdout.write("Ellipsoid fit: bench/fit-bench.ts has no benchEllipsoidFit export, skipped.\n\n");
    return;
  }
  process.stdout.write("Ellipsoid fit (bench/fit-bench.ts):\n");
  const result = await fitBench.benchEllipsoidFit();
  if (result !== undefined) process.stdout.write(`${typeof result === "string" ? result : JSON.stringify(result, null, 2)}\n`);
  process.stdout.write("\n");
}

async function main(): Promise<void> {
  const childAt = process.argv.indexOf("--child");
  if (childAt >= 0) {
    await measure(process.argv[childAt + 1] as Step, Number(process.argv[childAt + 2]));
    return;
  }
  await runEllipsoidBench();
  for (const samples of SIZES) csvFile(samples);
  process.stdout.write(`Capture analysis (node ${process.version}, one core, each row a fresh process):\n`);
  process.stdout.write(
    `${pad("step", 22)} ${pad("samples", 9)} ${pad("seconds", 9)} ${pad("samples/s", 12)} ${pad("peak MiB", 9)} ${pad("above base", 11)}\n`,
  );
  const startUp = runChild("start-up", 0);
  process.stdout.write(
    `${pad("start-up (no data)", 22)} ${pad("", 9)} ${pad("", 9)} ${pad("", 12)} ${pad(startUp.peakRssMiB.toFixed(0), 9)}\n`,
  );
  for (const samples of SIZES) {
    const data = runChild("data", samples);
    for (const step of STEPS.filter((s) => s !== "start-up")) {
      const m = step === "data" ? data : runChild(step, samples);
      const rate = step === "data" ? "" : Math.round(samples / m.seconds).toLocaleString("en-GB");
      // Streaming starts from a file, so its base is a process without the capture in memory.
      const base = step.startsWith("ingest") ? startUp : data;
      const above = step === "data" ? "" : (m.peakRssMiB - base.peakRssMiB).toFixed(0);
      process.stdout.write(
        `${pad(step === "data" ? "data only" : step, 22)} ${pad(samples.toLocaleString("en-GB"), 9)} ${pad(step === "data" ? "" : m.seconds.toFixed(3), 9)} ${pad(rate, 12)} ${pad(m.peakRssMiB.toFixed(0), 9)} ${pad(above, 11)}\n`,
      );
    }
  }
  // Are the intervals as wide with the fast fit (and, on long captures, the sandwich covariance)?
  const { benchIntervalWidths } = await import("./interval-bench");
  process.stdout.write("\n");
  benchIntervalWidths();
  // The command line against a plain numpy script, whole processes.
  const { benchCliAgainstNumpy } = await import("./cli-bench");
  benchCliAgainstNumpy();
  // The product's whole flow, from upload to results, through storage, the queue and the worker.
  const { benchEndToEnd } = await import("./e2e-bench");
  await benchEndToEnd();
  // Live class sessions: 60 viewers on Server-Sent Events against a production server.
  const { benchClassroom } = await import("./class-bench");
  await benchClassroom();
}

main().catch((error) => {
  process.stderr.write(`${(error as Error).stack ?? error}\n`);
  process.exitCode = 1;
});
