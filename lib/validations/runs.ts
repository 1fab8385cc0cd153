import { z } from "zod";
import { isCanonicalField } from "@/geometry/column-names";
import { FIELD_NAMES_HELP, SLOT_PATTERN } from "@/geometry/sensor-slots";
import { parseUnitForKind, type QuantityKind } from "@/geometry/units";
import { MODEL_CHOICES, RUN_STATUSES, UPLOAD_LIMITS, VERDICTS } from "@/lib/fleet-terms";

function unitText(kind: QuantityKind) {
  return z
    .string()
    .trim()
    .max(40)
    .refine(
      (text) => parseUnitForKind(text, kind) !== null,
      `"${kind}" unit not recognised (for example uT, m/s2, deg/s, ms, counts:0.15).`,
    )
    .optional();
}

const isMappingTarget = (value: string) => value === "ignore" || isCanonicalField(value);

export const createRunSchema = z
  .object({
    vehicleId: z.uuid({ error: "Choose a vehicle." }),
    siteId: z.uuid({ error: "Choose a site." }).nullable().optional(),
    capturedOn: z.iso.date({ error: "Give the capture date as YYYY-MM-DD." }),
    title: z.string().trim().max(160, "Title: use at most 160 characters.").optional().default(""),
    fileName: z
      .string()
      .trim()
      .min(1, "The file needs a name.")
      .max(255)
      .refine((n) => /\.(csv|tsv|txt)$/i.test(n), "Upload a .csv, .tsv or .txt file."),
    fileSize: z
      .number({ error: "fileSize must be a number of bytes." })
      .int()
      .positive("The file is empty.")
      .max(UPLOAD_LIMITS.maxBytes, `The file is larger than ${UPLOAD_LIMITS.maxBytes / 1024 / 1024} MB.`),
    /** CSV column → canonical field; columns not listed are recognised from their names. */
    columnMapping: z
      .record(z.string().max(120), z.string().refine(isMappingTarget, `Map columns to ignore, ${FIELD_NAMES_HELP}.`))
      .default({}),
    /** Units per quantity as written by the logger: "uT", "nT", "mG", "G", "m/s2", "g", "deg/s", "rad/s", "ms", or "counts:0.15". */
    units: z
      .object({
        magnetic: unitText("magnetic"),
        acceleration: unitText("acceleration"),
        rate: unitText("rate"),
        time: unitText("time"),
        current: unitText("current"),
      })
      .default({}),
    /** Capture slot ("compass_a", "accel_a", …) → the vehicle's sensor logged in it. */
    sensorSlots: z
      .record(z.string().regex(SLOT_PATTERN, "Slots are named like compass_a, compass_b, accel_a, gyro_a."), z.uuid())
      .default({}),
    /**
     * The file's column names, in order, as its header line gives them. When sent, the server
     * recognises them (with columnMapping) and a current or throttle column makes the run a
     * motor run, whatever powersMotors says.
     */
    columns: z
      .array(
        z.string({ error: "columns: each column name must be text." }).max(1000, "columns: a column name is at most 1000 characters."),
        {
          error: "columns must be a list of the file's column names.",
        },
      )
      .max(UPLOAD_LIMITS.maxColumns, `columns: the file may have at most ${UPLOAD_LIMITS.maxColumns} columns.`)
      .optional(),
    model: z.enum(MODEL_CHOICES).default("auto"),
    /** The caller says the motors ran; the server also decides this from the columns and the stored file. */
    powersMotors: z.boolean({ error: "powersMotors must be true or false." }).default(false),
    /** Required when the capture powers motors: the person confirmed the cautions. */
    safetyAcknowledged: z.boolean({ error: "safetyAcknowledged must be true or false." }).default(false),
  })
  .refine((r) => !r.powersMotors || r.safetyAcknowledged, {
    path: ["safetyAcknowledged"],
    message: "This capture powers motors: confirm the safety cautions first.",
  });

export const reprocessSchema = z.object({
  model: z.enum(MODEL_CHOICES).default("auto"),
  siteId: z.uuid().nullable().optional(),
  /** Needed when the stored file logs motor current or throttle and the run was never confirmed. */
  safetyAcknowledged: z.boolean({ error: "safetyAcknowledged must be true or false." }).default(false),
});

/** The optional body of POST …/runs/{id}/uploaded: the confirmation, when the stored file turns out to be a motor run. */
export const markUploadedSchema = z.object({
  safetyAcknowledged: z.boolean({ error: "safetyAcknowledged must be true or false." }).default(false),
});

export const runListQuerySchema = z.object({
  vehicleId: z.uuid().optional(),
  sensorId: z.uuid().optional(),
  verdict: z.enum(VERDICTS).optional(),
  status: z.enum(RUN_STATUSES).optional(),
  uploaderId: z.uuid().optional(),
  from: z.iso.date().optional(),
  to: z.iso.date().optional(),
  search: z.string().max(120).optional(),
  sort: z
    .enum(["capturedOn", "createdAt", "verdict", "coverageFraction", "residualRms", "fieldStrength", "offsetNorm", "vehicle"])
    .default("capturedOn"),
  order: z.enum(["asc", "desc"]).default("desc"),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(25),
});
export type RunListQuery = z.infer<typeof runListQuerySchema>;
