/**
 * The command line against a plain numpy script: whole processes, on the same 1,000,000-
 * sample magnetometer CSV, alternated in one run so that a busy machine slows both alike.
 *
 * - `npm run fit -- file.csv`: what a person types (npm's own start-up included);
 * - `node dist/cli/fit.mjs file.csv`: the bundled CLI run by plain node, then with the V8
 *   settings `npm run fit` uses;
 * - `python3 bench/numpy-fit.py file.csv`: loadtxt + least squares + eigen-decomposition,
 *   the reference (it fits and prints far less: no outlier rejection, intervals or checks).
 * Prints the median of REPEATS runs of each and the ratios to numpy; the goal is ≤ 1.0×.
 * Skips the numpy rows (saying so) when python3 has no numpy.
 * Samples: a 48 µT field with strong soft iron, 0.5 µT noise, directions uniform on the
 * sphere, 100 Hz (invented data), written with three decimals.
 */
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { createRandom } from "@/geometry/random";

const ROWS = 1_000_000;
const REPEATS = 5;
const ROOT = path.resolve(__dirname, "..");
const OUT = path.join(ROOT, "bench", "out");
const BUNDLE = path.join(ROOT, "dist", "cli", "fit.mjs");
const NODE_SETTINGS = ["--max-semi-space-size=32", "--no-lazy-feedback-allocation"];

function writeCapture(file: string, rows: number): void {
  if (fs.existsSync(file)) return;
  fs.mkdirSync(path.dirname(file), { recursive: true });
  const random = createRandom(7);
  const s = [
    [1.18, 0.06, -0.04],
    [0.06, 0.86, 0.08],
    [-0.04, 0.08, 1.05],
  ];
  const fd = fs.openSync(file, "w");
  let lines: string[] = ["time,compass_a.x,compass_a.y,compass_a.z"];
  for (let i = 0; i < rows; i++) {
    const g = [random.gaussian(), random.gaussian(), random.gaussian()];
    const k = 48 / Math.hypot(g[0], g[1], g[2]);
    const u = g.map((v) => v * k);
    const x = s[0][0] * u[0] + s[0][1] * u[1] + s[0][2] * u[2] + 30 + random.gaussian(0, 0.5);
    const y = s[1][0] * u[0] + s[1][1] * u[1] + s[1][2] * u[2] - 12 + random.gaussian(0, 0.5);
    const z = s[2][0] * u[0] + s[2][1] * u[1] + s[2][2] * u[2] + 55 + random.gaussian(0, 0.5);
    lines.push(`${(i / 100).toFixed(3)},${x.toFixed(3)},${y.toFixed(3)},${z.toFixed(3)}`);
    if (lines.length >= 50_000) {
      fs.writeSync(fd, lines.join("\n") + "\n");
      lines = [];
    }
  }
  if (lines.length) fs.writeSync(fd, lines.join("\n") + "\n");
  fs.closeSync(fd);
}

interface Contender {
  label: string;
  command: string;
  args: string[];
}

function timeOnce(c: Contender): number {
  const started = performance.now();
  const child = spawnSync(c.command, c.args, { cwd: ROOT, encoding: "utf8", maxBuffer: 64 << 20, stdio: ["ignore", "pipe", "pipe"] });
  const seconds = (performance.now() - started) / 1000;
  if (child.status !== 0) throw new Error(`${c.label} failed (${child.status}):\n${child.stderr.slice(0, 2000)}`);
  return seconds;
}

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];

/** Prints the table of medians and ratios; returns the ratios for callers that want them. */
export function benchCliAgainstNumpy(): { npmRatio: number | null; nodeRatio: number | null } {
  const file = path.join(OUT, `cli-mag-${ROWS}.csv`);
  writeCapture(file, ROWS);
  const site = ["--site", "52.1,5.2,10", "--date", "2026-06-01"];
  const contenders: Contender[] = [{ label: "npm run fit", command: "npm", args: ["run", "fit", "--silent", "--", file, ...site] }];
  // npm run fit builds the bundle when it is missing or stale; the first run below warms that up.
  const hasNumpy = spawnSync("python3", ["-c", "import numpy"], { stdio: "ignore" }).status === 0;
  const numpy: Contender = { label: "numpy script", command: "python3", args: [path.join("bench", "numpy-fit.py"), file] };
  timeOnce(contenders[0]);
  if (fs.existsSync(BUNDLE)) {
    contenders.push({ label: "node dist/cli/fit.mjs", command: process.execPath, args: [BUNDLE, file, ...site] });
    // The same with the V8 settings npm run fit starts node with (package.json, scripts/fit.mjs).
    contenders.push({ label: "node + settings", command: process.execPath, args: [...NODE_SETTINGS, BUNDLE, file, ...site] });
  }
  if (hasNumpy) contenders.push(numpy);
  const times = new Map<string, number[]>(contenders.map((c) => [c.label, []]));
  for (let r = 0; r < REPEATS; r++) for (const c of contenders) times.get(c.label)!.push(timeOnce(c));
  const reference = hasNumpy ? median(times.get(numpy.label)!) : null;
  process.stdout.write(
    `\nCommand line vs numpy: ${ROWS.toLocaleString("en-GB")}-sample magnetometer CSV (${(fs.statSync(file).size / 1048576).toFixed(1)} MiB), whole processes alternated, median of ${REPEATS}\n`,
  );
  process.stdout.write("contender                  median s   runs (s)                          ratio to numpy\n");
  const ratios: Record<string, number | null> = {};
  for (const c of contenders) {
    const t = times.get(c.label)!;
    const ratio = reference ? median(t) / reference : null;
    ratios[c.label] = ratio;
    process.stdout.write(
      `${c.label.padEnd(26)} ${median(t).toFixed(2).padStart(8)}   ${t
        .map((v) => v.toFixed(2))
        .join(" ")
        .padEnd(33)} ${ratio === null ? "" : `${ratio.toFixed(2)}×`}\n`,
    );
  }
  if (!hasNumpy) process.stdout.write("numpy is not installed for python3 here: the reference rows were skipped.\n");
  else process.stdout.write("Goal: npm run fit ≤ 1.0× numpy (stretch 0.5×).\n");
  return { npmRatio: ratios["npm run fit"] ?? null, nodeRatio: ratios["node dist/cli/fit.mjs"] ?? null };
}

if (process.argv[1] && path.resolve(process.argv[1]) === path.resolve(__filename)) benchCliAgainstNumpy();
