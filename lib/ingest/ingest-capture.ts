/**
 * The one way a capture file becomes results: the upload worker and `npm run fit` both call
 * ingestCapture, so they read with the same limits, date the capture the same way (noon UTC
 * of its calendar day), settle units the same way (units stated by the person win over units
 * written in column names, which win over guesses from the readings) and produce the same
 * results document for the same file and inputs.
 *
 * No database, storage or framework here: the command line bundles this module.
 */
import type { Readable } from "node:stream";
import { analyseCapture, type AnalyseCaptureOptions, type CaptureAnalysis } from "@/geometry/analyse-capture";
import { captureDateAtNoonUtc, captureDayOf } from "@/geometry/capture-date";
import type { CaptureField } from "@/geometry/types";
import { UPLOAD_LIMITS } from "@/lib/fleet-terms";
import { parseCsvStream, type IngestedCapture } from "@/lib/ingest/csv-table";
import { resultsDocument, type ResultsDocument } from "@/lib/jobs/results-json";

export interface CaptureLimits {
  /** Fewest data rows accepted. */
  minRows: number;
  /** Most data rows accepted. */
  maxRows: number;
  /** Most columns in the header. */
  maxColumns: number;
}

/** The limits on every capture wherever it is read: the upload's, from lib/fleet-terms.ts. */
export const CAPTURE_LIMITS: Readonly<CaptureLimits> = Object.freeze({
  minRows: UPLOAD_LIMITS.minSamples,
  maxRows: UPLOAD_LIMITS.maxRows,
  maxColumns: UPLOAD_LIMITS.maxColumns,
});

/**
 * What a person says about a capture besides its file. Every option of the analysis passes
 * through (site, units, model, mountings, seed, and whatever is added there later) except the
 * date, which is given as the calendar day, and the unit hints, which come from the file.
 */
export interface CaptureInputs extends Omit<AnalyseCaptureOptions, "date" | "unitHints"> {
  /** Column name → canonical field or "ignore", overriding recognition. */
  map?: Record<string, CaptureField | "ignore">;
  /** Calendar day of the capture, YYYY-MM-DD. Without one and with a site, today (UTC) is used. */
  capturedOn?: string | null;
  /** Row and column limits; default CAPTURE_LIMITS. */
  limits?: CaptureLimits;
}

export interface IngestHooks {
  /** Called between reading the file and fitting it (progress, a test's simulated crash). */
  afterParse?: (ingested: IngestedCapture) => void | Promise<void>;
}

export interface IngestedRun {
  ingested: IngestedCapture;
  analysis: CaptureAnalysis;
  /** The results document: the same for the command line and the worker. */
  document: ResultsDocument;
}

/** The options of the analysis for the inputs, the capture date set at noon UTC of its day. */
export function analysisOptionsOf(inputs: CaptureInputs, ingested: IngestedCapture): AnalyseCaptureOptions {
  const { map: _map, capturedOn, limits: _limits, ...options } = inputs;
  const site = options.site ?? null;
  const day = capturedOn ?? (site ? captureDayOf(new Date()) : null);
  return {
    ...options,
    site,
    date: day === null ? null : captureDateAtNoonUtc(day),
    unitHints: ingested.unitHints,
    seed: options.seed ?? 1,
  };
}

/**
 * Reads a capture from a byte stream and analyses it. Throws an IngestError (row and column
 * named) for a file that cannot be read, and a RangeError for inputs the analysis refuses.
 */
export async function ingestCapture(input: Readable, inputs: CaptureInputs = {}, hooks: IngestHooks = {}): Promise<IngestedRun> {
  const limits = inputs.limits ?? CAPTURE_LIMITS;
  const ingested = await parseCsvStream(input, {
    map: inputs.map ?? {},
    minRows: limits.minRows,
    maxRows: limits.maxRows,
    maxColumns: limits.maxColumns,
    // Without a time column the analysis takes samples as evenly spaced and says so.
    requireTime: false,
  });
  await hooks.afterParse?.(ingested);
  const analysis = analyseCapture(ingested.table, analysisOptionsOf(inputs, ingested));
  analysis.notes.unshift(...ingested.notes);
  if (ingested.ignoredColumns.length > 0) analysis.notes.push(`Columns not used: ${ingested.ignoredColumns.join(", ")}.`);
  return { ingested, analysis, document: resultsDocument(analysis, ingested) };
}
