import { z } from "zod";
import { ACCEL_UNITS, FIELD_UNITS, MODEL_CHOICES, PLACEMENTS, RATE_UNITS, SENSOR_KINDS, VEHICLE_KINDS } from "@/lib/fleet-terms";
import { IDENTITY_MOUNTING_ID, MOUNTING_IDS } from "@/geometry/mounting-rotations";
import { MAGNETOMETER_RANGE_LIMITS_UT } from "@/geometry/magnetometer-range";

const text = (max: number, label: string) => z.string().trim().max(max, `${label}: use at most ${max} characters.`);
const optionalText = (max: number, label: string) => text(max, label).optional().default("");

/** Numbers arrive as strings from forms and as numbers from JSON. */
const number = (label: string, min: number, max: number) =>
  z.coerce
    .number({ error: `${label} must be a number.` })
    .refine((v) => Number.isFinite(v), `${label} must be a number.`)
    .refine((v) => v >= min && v <= max, `${label} must be between ${min} and ${max}.`);

export const siteSchema = z.object({
  name: text(120, "Name").min(1, "Give the site a name."),
  latitudeDeg: number("Latitude", -90, 90),
  longitudeDeg: number("Longitude", -180, 180),
  altitudeM: number("Altitude", -500, 9000).default(0),
  notes: optionalText(2000, "Notes"),
});

export const vehicleSchema = z.object({
  name: text(120, "Name").min(1, "Give the vehicle a name."),
  kind: z.enum(VEHICLE_KINDS, { error: "Choose what kind of vehicle it is." }),
  airframe: optionalText(200, "Airframe"),
  serialTag: optionalText(80, "Serial or tag"),
  customer: optionalText(120, "Owner or customer"),
  notes: optionalText(4000, "Notes"),
});

export const vehicleUpdateSchema = vehicleSchema.extend({
  archived: z.union([z.boolean(), z.enum(["on", "true", "false"]).transform((v) => v !== "false")]).optional(),
});

const ALL_UNITS = [...new Set([...FIELD_UNITS, ...ACCEL_UNITS, ...RATE_UNITS])] as [string, ...string[]];

const RANGE_MESSAGE = `Full-scale range: give the compass's range in µT, between ${MAGNETOMETER_RANGE_LIMITS_UT.min} and ${MAGNETOMETER_RANGE_LIMITS_UT.max}, or leave it empty for the common default.`;

/** A magnetometer's ± range in µT; empty or absent means not stated (null). */
const fullScaleRange = z.preprocess(
  (v) => (v === undefined || (typeof v === "string" && v.trim() === "") ? null : v),
  z.coerce
    .number({ error: RANGE_MESSAGE })
    .refine((v) => Number.isFinite(v) && v >= MAGNETOMETER_RANGE_LIMITS_UT.min && v <= MAGNETOMETER_RANGE_LIMITS_UT.max, RANGE_MESSAGE)
    .nullable(),
);

export const sensorSchema = z
  .object({
    kind: z.enum(SENSOR_KINDS, { error: "Choose the kind of sensor." }),
    label: text(80, "Label").min(1, "Give the sensor a label, such as “board” or “mast module”."),
    placement: z.enum(PLACEMENTS, { error: "Choose internal or external." }).default("internal"),
    mountingRotation: z
      .enum(MOUNTING_IDS, { error: "mountingRotation: choose one of the 48 mountings, e.g. x-right.z-down." })
      .default(IDENTITY_MOUNTING_ID),
    units: z.enum(ALL_UNITS, { error: "Choose the units the sensor logs in." }),
    columnHints: z
      .union([
        z.array(text(80, "Column")),
        z.string().transform((s) =>
          s
            .split(",")
            .map((c) => c.trim())
            .filter(Boolean),
        ),
      ])
      .default([]),
    fullScaleRangeUt: fullScaleRange,
  })
  .refine((s) => s.kind === "magnetometer" || s.fullScaleRangeUt === null, {
    path: ["fullScaleRangeUt"],
    message: "Full-scale range: only a magnetometer's range is used; leave it empty for this kind of sensor.",
  })
  .refine(
    (s) =>
      (s.kind === "magnetometer" && (FIELD_UNITS as readonly string[]).includes(s.units)) ||
      (s.kind === "accelerometer" && (ACCEL_UNITS as readonly string[]).includes(s.units)) ||
      (s.kind === "gyroscope" && (RATE_UNITS as readonly string[]).includes(s.units)),
    { path: ["units"], message: "Those units do not fit this kind of sensor." },
  );

export const modelChoiceSchema = z.enum(MODEL_CHOICES, { error: "Choose a model: auto, sphere, axis or full." });

export const uuidSchema = (label: string) => z.uuid({ error: `${label} is not a valid id.` });
