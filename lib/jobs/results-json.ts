import type { CaptureAnalysis } from "@/geometry/analyse-capture";
import { hasMotorFields } from "@/geometry/motor-safety";
import type { IngestedCapture } from "@/lib/ingest/csv-table";

/**
 * Turns an analysis into plain JSON for a JSONB column: typed arrays become arrays and
 * non-finite numbers become null (JSON has neither).
 */
export function toJsonSafe(value: unknown): unknown {
  if (value === null || value === undefined) return null;
  if (typeof value === "number") return Number.isFinite(value) ? value : null;
  if (typeof value !== "object") return value;
  if (ArrayBuffer.isView(value)) return Array.from(value as unknown as ArrayLike<number>, (v) => (Number.isFinite(v) ? v : null));
  if (Array.isArray(value)) return value.map(toJsonSafe);
  if (value instanceof Date) return value.toISOString();
  const out: Record<string, unknown> = {};
  for (const [key, inner] of Object.entries(value)) if (inner !== undefined && typeof inner !== "function") out[key] = toJsonSafe(inner);
  return out;
}

/** The results of one capture as plain JSON: what the command line prints and the worker stores. */
export type ResultsDocument = Record<string, unknown>;

/**
 * The results document of an analysed capture, the same wherever it is made: the verdict and
 * the per-sensor results first, `powersMotors: true` for a motor run, no `accelerometer` key
 * when there is none, and how the file was read under `file`. The worker adds where it stored
 * the samples and the view (`samples`, `view`); nothing else differs.
 */
export function resultsDocument(analysis: CaptureAnalysis, ingested: IngestedCapture): ResultsDocument {
  const { verdict, verdictSummary, diagnosis, magnetometers, accelerometer, checks, ...rest } = analysis;
  return toJsonSafe({
    verdict,
    verdictSummary,
    ...(hasMotorFields(ingested.table.fields) ? { powersMotors: true } : {}),
    diagnosis,
    magnetometers,
    ...(accelerometer ? { accelerometer } : {}),
    checks,
    ...rest,
    file: { delimiter: ingested.delimiter, ignoredColumns: ingested.ignoredColumns, recognition: ingested.recognition },
  }) as ResultsDocument;
}
