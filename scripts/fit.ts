/**
 * Command-line analysis of one calibration capture.
 *
 *   npm run fit -- <file.csv> [--site lat,lon,alt] [--date YYYY-MM-DD] [--units uT]
 *                  [--model auto|sphere|axis|full] [--map col=field,...]
 *                  [--mount compass_b=x-right.z-down,...] [--seed N]
 *
 * Prints one JSON document on stdout: the results document the upload worker stores, read by
 * the same ingest (lib/ingest/ingest-capture.ts). A file that cannot be read gets a message
 * naming the row and column on stderr and exit code 2; so do bad arguments. A file with a
 * motor current or throttle column is a motor run: the document says `"powersMotors": true`
 * and the full cautions go to stderr, so stdout stays one JSON document. Southern and western
 * sites are typed as written: --site -33.9,151.2,0.
 *
 * `npm run fit` runs scripts/fit.mjs, which runs this file compiled (dist/cli/fit.mjs, built
 * by scripts/build-cli.mjs when missing or older than its sources).
 */
import { createReadStream } from "node:fs";
import { MOTOR_SAFETY_CAUTION, motorColumnsOf } from "@/geometry/motor-safety";
import { IngestError } from "@/lib/ingest/csv-table";
import { ingestCapture } from "@/lib/ingest/ingest-capture";
import { parseFitArgs, USAGE, UsageError, type FitArgs } from "./fit-args";

/** The cautions for a motor run, naming the column that makes it one. */
function motorRunWarning(columns: { header: string; field: string }[]): string {
  const named = columns.map((c) => `"${c.header.replace(/[\u0000-\u001f\u007f]+/g, " ").slice(0, 60)}" (${c.field})`).join(", ");
  return `Motor run: ${named} ${columns.length === 1 ? "means" : "mean"} the motors were powered during this capture.\n${MOTOR_SAFETY_CAUTION}\n`;
}

async function main(argv: string[]): Promise<number> {
  let args: FitArgs;
  try {
    args = parseFitArgs(argv);
  } catch (error) {
    if (!(error instanceof UsageError)) throw error;
    process.stderr.write(`${error.message}\n${USAGE}\n`);
    return 2;
  }
  if (args.help) {
    process.stdout.write(`${USAGE}\n`);
    return 0;
  }
  const { file, inputs } = args;
  try {
    const { document } = await ingestCapture(createReadStream(file), inputs, {
      afterParse: (ingested) => {
        const motorColumns = motorColumnsOf(ingested.recognition);
        if (motorColumns.length > 0) process.stderr.write(motorRunWarning(motorColumns));
      },
    });
    process.stdout.write(`${JSON.stringify(document, null, 2)}\n`);
    return 0;
  } catch (error) {
    if (error instanceof IngestError) {
      process.stderr.write(`${file}: ${error.message}\n`);
      return 2;
    }
    if (error instanceof RangeError) {
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
