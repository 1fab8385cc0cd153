/**
 * The upload form's own checks, made before anything is sent, and the body of `POST runs`
 * built from the form's values. Pure functions: no React.
 */
import { UPLOAD_LIMITS, type ModelChoice } from "@/lib/fleet-terms";
import type { ColumnMapping, MappingReview, UnitQuantity } from "./capture-mapping";
import type { FilePreview } from "./preview-types";

/** Longest column name the API takes in a mapping. */
const MAX_COLUMN_NAME = 120;
/** Longest column name the API takes in `columns`. */
const MAX_LISTED_COLUMN_NAME = 1000;

/** Error keys the form shows beside a field; any other key from the API goes in the summary. */
const PLACED_KEYS =
  /^(vehicleId|siteId|capturedOn|title|model|safetyAcknowledged|fileName|fileSize|sensorSlots(\..*)?|units\.\w+|columnMapping(\..*)?)$/;

export interface RunFormValues {
  file: File | null;
  preview: FilePreview | null;
  previewError: string | null;
  review: MappingReview | null;
  mapping: ColumnMapping;
  units: Partial<Record<UnitQuantity, string>>;
  slotSensors: Record<string, string>;
  vehicleId: string;
  siteId: string;
  capturedOn: string;
  title: string;
  model: ModelChoice;
  powersMotors: boolean;
  acknowledged: boolean;
}

/** Today in the browser's own time zone, as YYYY-MM-DD. */
export function localToday(): string {
  const now = new Date();
  return `${now.getFullYear()}-${String(now.getMonth() + 1).padStart(2, "0")}-${String(now.getDate()).padStart(2, "0")}`;
}

function positiveScale(unit: string): boolean {
  if (!unit.startsWith("counts:")) return true;
  const scale = Number(unit.slice("counts:".length));
  return Number.isFinite(scale) && scale > 0;
}

/** What stops the upload, keyed like the API's `fields` so each shows beside its control. */
export function checkRunForm(form: RunFormValues): Record<string, string> {
  const found: Record<string, string> = {};
  const { file, preview, review } = form;
  if (!file) found.fileName = "Choose the capture file first.";
  else if (!preview) found.fileName = form.previewError ?? "The preview is still being read; wait a moment.";
  else if (preview.headers.length > UPLOAD_LIMITS.maxColumns) {
    found.fileName = `The file has ${preview.headers.length} columns; the limit is ${UPLOAD_LIMITS.maxColumns}.`;
  }
  if (review && review.problems.length > 0) found.columnMapping = review.problems[0];
  for (const header of preview?.headers ?? []) {
    if (header.length > MAX_COLUMN_NAME && (form.mapping[header] ?? "ignore") !== "ignore") {
      found[`columnMapping.${header}`] =
        `Only columns with names up to ${MAX_COLUMN_NAME} characters can be mapped; shorten this one in the file.`;
    }
  }
  if (!form.vehicleId) found.vehicleId = "Choose the vehicle this capture comes from.";
  if (!/^\d{4}-\d{2}-\d{2}$/.test(form.capturedOn)) found.capturedOn = "Give the capture date.";
  for (const [quantity, unit] of Object.entries(form.units)) {
    if (!positiveScale(unit)) found[`units.${quantity}`] = "Give the scale per count as a positive number, such as 0.15.";
  }
  if (form.powersMotors && !form.acknowledged)
    found.safetyAcknowledged = "This capture powers the motors: confirm the cautions before uploading.";
  return found;
}

/**
 * The body of `POST runs`. Every column's meaning is stated, so the server reads the file as
 * previewed; a left-out column whose name is too long to be a key is not listed (nothing reads it).
 * The header's names go too (`columns`): the server tells a motor run from them. A header with
 * a name beyond the API's limit is not sent; the server then reads it from the stored file.
 */
export function runRequestBody(form: RunFormValues & { file: File; preview: FilePreview }): Record<string, unknown> {
  const columnMapping: ColumnMapping = {};
  for (const header of form.preview.headers) {
    const choice = form.mapping[header] ?? "ignore";
    if (choice !== "ignore" || header.length <= MAX_COLUMN_NAME) columnMapping[header] = choice;
  }
  const slots = form.review ? [...form.review.slots.mag, ...form.review.slots.accel, ...form.review.slots.gyro] : [];
  return {
    vehicleId: form.vehicleId,
    siteId: form.siteId || null,
    capturedOn: form.capturedOn,
    title: form.title.trim(),
    fileName: form.file.name,
    fileSize: form.file.size,
    columnMapping,
    ...(form.preview.headers.every((header) => header.length <= MAX_LISTED_COLUMN_NAME) ? { columns: form.preview.headers } : {}),
    units: Object.fromEntries(Object.entries(form.units).filter(([, unit]) => unit !== "")),
    sensorSlots: Object.fromEntries(slots.filter((slot) => form.slotSensors[slot]).map((slot) => [slot, form.slotSensors[slot]])),
    model: form.model,
    powersMotors: form.powersMotors,
    safetyAcknowledged: form.powersMotors && form.acknowledged,
  };
}

/** The API's field errors the form has no place for, as "field: message" lines for the summary. */
export function unplacedErrors(fields: Record<string, string>): string[] {
  return Object.entries(fields)
    .filter(([key]) => !PLACED_KEYS.test(key))
    .map(([key, message]) => `${key}: ${message}`);
}
