/**
 * Command-line analysis of one calibration capture.
 *
 *   npm run fit -- <file.csv> [--site lat,lon,alt] [--date YYYY-MM-DD] [--units uT]
 *                  [--model auto|sphere|axis|full] [--map col=field,...]
 *                  [--mount compass_b=x-right.z-down,...] [--seed N]
 *
 * Prints one JSON document on stdout. A file that cannot be read gets a message naming the
 * row and column on stderr and exit code 2; so do bad arguments. A file with a motor current
 * or throttle column is a motor run: the document says `"powersMotors": true` and the full
 * cautions go to stderr, so stdout stays one JSON document. A southern or western
 * site starts with a minus sign: write it as --site=-33.9,18.4,20.
 */
import { createReadStream } from "node:fs";
import { parseArgs } from "node:util";
import { analyseCapture, type CaptureAnalysis } from "@/geometry/analyse-capture";
import type { CaptureUnits } from "@/geometry/capture-units";
import { parseColumnMap } from "@/geometry/column-names";
import type { Site } from "@/geometry/magnetic-reference";
import type { MagModelChoice } from "@/geometry/magnetometer-types";
import { MOTOR_SAFETY_CAUTION, motorColumnsOf } from "@/geometry/motor-safety";
import { mountingRotationById } from "@/geometry/mounting-rotations";
import { familyOfSlot } from "@/geometry/sensor-slots";
import { parseUnit } from "@/geometry/units";
import { IngestError, parseCsvStream } from "@/lib/ingest/csv-table";

const USAGE =
  "usage: npm run fit -- <file.csv> [--site lat,lon,alt] [--date YYYY-MM-DD] [--units uT[,g,deg/s,ms]] [--model auto|sphere|axis|full] [--map col=field,...] [--mount compass_b=x-right.z-down,...] [--seed N]";

class UsageError extends Error {}

function parseSite(text: string): Site {
  const parts = text.split(",").map((part) => part.trim());
  const [lat, lon, alt = "0"] = parts;
  const numbers = [lat, lon, alt].map(Number);
  if (parts.length < 2 || parts.length > 3 || parts.some((p) => p === "") || numbers.some((n) => !Number.isFinite(n))) {
    throw new UsageError(`--site "${text}" should be latitude,longitude[,altitude in metres], e.g. 52.1,5.2,10`);
  }
  if (Math.abs(numbers[0]) > 90) throw new UsageError(`--site latitude ${numbers[0]} is outside −90…90`);
  if (Math.abs(numbers[1]) > 360) throw new UsageError(`--site longitude ${numbers[1]} is outside −180…360`);
  return { latitudeDeg: numbers[0], longitudeDeg: numbers[1], altitudeM: numbers[2] };
}

function parseDate(text: string): Date {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(text.trim());
  const date = match ? new Date(Date.UTC(Number(match[1]), Number(match[2]) - 1, Number(match[3]))) : null;
  if (!date || date.getUTCDate() !== Number(match![3])) throw new UsageError(`--date "${text}" should be a date written YYYY-MM-DD`);
  return date;
}

function parseUnits(text: string): CaptureUnits {
  const units: CaptureUnits = {};
  for (const item of text
    .split(",")
    .map((s) => s.trim())
    .filter(Boolean)) {
    const spec = parseUnit(item);
    if (!spec)
      throw new UsageError(`--units: "${item}" is not a unit we know (e.g. uT, nT, mG, G, m/s2, g, deg/s, rad/s, ms, mag:counts:0.15)`);
    (units as Record<string, unknown>)[spec.kind] = spec;
  }
  return units;
}

function parseMounts(text: string): Record<string, string> {
  const mounts: Record<string, string> = {};
  for (const pair of text.split(",").filter((s) => s.trim())) {
    const [sensor, rotation] = pair.split("=").map((s) => s.trim());
    if (familyOfSlot(sensor ?? "") !== "mag" || !rotation) {
      throw new UsageError(`--mount "${pair}" should be compass=mounting, e.g. compass_b=x-right.z-down`);
    }
    if (!mountingRotationById(rotation)) {
      throw new UsageError(
        `--mount "${pair}": "${rotation}" is not one of the 48 mountings; write where the module's x and z axes point, e.g. x-right.z-down, x-forward.z-up, x-forward-right.z-down`,
      );
    }
    mounts[sensor] = rotation;
  }
  return mounts;
}

/**
 * The document printed: the analysis with the verdict and the per-sensor results first, and
 * no accelerometer key when there is none.
 */
function toDocument(analysis: CaptureAnalysis, powersMotors: boolean): Record<string, unknown> {
  const { verdict, verdictSummary, diagnosis, magnetometers, accelerometer, checks, ...rest } = analysis;
  return {
    verdict,
    verdictSummary,
    ...(powersMotors ? { powersMotors: true } : {}),
    diagnosis,
    magnetometers,
    ...(accelerometer ? { accelerometer } : {}),
    checks,
    ...rest,
  };
}

/** The cautions for a motor run, naming the column that makes it one. */
function motorRunWarning(columns: { header: string; field: string }[]): string {
  const named = columns.map((c) => `"${c.header.replace(/[\u0000-\u001f\u007f]+/g, " ").slice(0, 60)}" (${c.field})`).join(", ");
  return `Motor run: ${named} ${columns.length === 1 ? "means" : "mean"} the motors were powered during this capture.\n${MOTOR_SAFETY_CAUTION}\n`;
}

async function main(argv: string[]): Promise<number> {
  let values;
  let positionals;
  try {
    ({ values, positionals } = parseArgs({
      args: argv,
      allowPositionals: true,
      options: {
        site: { type: "string" },
        date: { type: "string" },
        units: { type: "string" },
        model: { type: "string" },
        map: { type: "string" },
        mount: { type: "string" },
        seed: { type: "string" },
        help: { type: "boolean", short: "h" },
      },
    }));
  } catch (error) {
    process.stderr.write(`${(error as Error).message}\n${USAGE}\n`);
    return 2;
  }
  if (values.help) {
    process.stdout.write(`${USAGE}\n`);
    return 0;
  }
  const file = positionals[0];
  try {
    if (!file || positionals.length > 1) throw new UsageError("give exactly one capture file");
    const model = (values.model ?? "auto") as MagModelChoice;
    if (!["auto", "sphere", "axis", "full"].includes(model))
      throw new UsageError(`--model "${values.model}" should be auto, sphere, axis or full`);
    const site = values.site ? parseSite(values.site) : null;
    const date = values.date ? parseDate(values.date) : null;
    const units = values.units ? parseUnits(values.units) : {};
    let map;
    try {
      map = values.map ? parseColumnMap(values.map) : {};
    } catch (error) {
      throw new UsageError(`--map: ${(error as Error).message}`);
    }
    const mountingRotations = values.mount ? parseMounts(values.mount) : {};
    const seed = values.seed === undefined ? 1 : Number(values.seed);
    if (!Number.isInteger(seed)) throw new UsageError(`--seed "${values.seed}" should be a whole number`);

    const ingested = await parseCsvStream(createReadStream(file), { map });
    const motorColumns = motorColumnsOf(ingested.recognition);
    if (motorColumns.length > 0) process.stderr.write(motorRunWarning(motorColumns));
    const analysis = analyseCapture(ingested.table, {
      site,
      date,
      units,
      unitHints: ingested.unitHints,
      model,
      mountingRotations,
      seed,
    });
    analysis.notes.unshift(...ingested.notes);
    if (ingested.ignoredColumns.length > 0) analysis.notes.push(`Columns not used: ${ingested.ignoredColumns.join(", ")}.`);
    process.stdout.write(`${JSON.stringify(toDocument(analysis, motorColumns.length > 0), null, 2)}\n`);
    return 0;
  } catch (error) {
    if (error instanceof IngestError) {
      process.stderr.write(`${file}: ${error.message}\n`);
      return 2;
    }
    if (error instanceof UsageError || error instanceof RangeError) {
      process.stderr.write(`${error.message}\n${USAGE}\n`);
      return 2;
    }
    const code = (error as NodeJS.ErrnoException).code;
    if (code === "ENOENT" || code === "EISDIR" || code === "EACCES") {
      process.stderr.write(`${file}: cannot read the file (${code})\n`);
      return 2;
    }
    throw error;
  }
}

main(process.argv.slice(2)).then(
  (code) => {
    process.exitCode = code;
  },
  (error) => {
    process.stderr.write(`${(error as Error).stack ?? error}\n`);
    process.exitCode = 1;
  },
);
