/** Vocabulary of the fleet: shared by server and client code. */
export const VEHICLE_KINDS = ["multirotor", "fixed-wing", "vtol", "rover", "boat", "other"] as const;
export type VehicleKind = (typeof VEHICLE_KINDS)[number];
export const VEHICLE_KIND_LABELS: Record<VehicleKind, string> = {
  multirotor: "Multirotor",
  "fixed-wing": "Fixed-wing",
  vtol: "VTOL",
  rover: "Rover",
  boat: "Boat",
  other: "Other",
};

export const SENSOR_KINDS = ["magnetometer", "accelerometer", "gyroscope"] as const;
export type SensorKind = (typeof SENSOR_KINDS)[number];
export const SENSOR_KIND_LABELS: Record<SensorKind, string> = {
  magnetometer: "Magnetometer",
  accelerometer: "Accelerometer",
  gyroscope: "Gyroscope",
};

export const PLACEMENTS = ["internal", "external"] as const;
export type Placement = (typeof PLACEMENTS)[number];

export const FIELD_UNITS = ["uT", "nT", "mG", "G", "counts"] as const;
export const ACCEL_UNITS = ["m/s2", "g", "counts"] as const;
export const RATE_UNITS = ["rad/s", "deg/s", "counts"] as const;

export const RUN_STATUSES = ["awaiting-file", "uploaded", "processing", "done", "failed"] as const;
export type RunStatus = (typeof RUN_STATUSES)[number];
export const RUN_STATUS_LABELS: Record<RunStatus, string> = {
  "awaiting-file": "Waiting for the file",
  uploaded: "Queued",
  processing: "Fitting",
  done: "Ready",
  failed: "Could not process",
};

export const VERDICTS = ["pass", "warn", "fail"] as const;
export type Verdict = (typeof VERDICTS)[number];

export const MODEL_CHOICES = ["auto", "sphere", "axis", "full"] as const;
export type ModelChoice = (typeof MODEL_CHOICES)[number];
export const MODEL_CHOICE_LABELS: Record<ModelChoice, string> = {
  auto: "Let the data decide",
  sphere: "Offset only (sphere)",
  axis: "Offset and per-axis scale",
  full: "Offset and full soft-iron matrix",
};

/** Limits stated on the upload page and enforced on the server. */
export const UPLOAD_LIMITS = {
  maxBytes: 200 * 1024 * 1024,
  maxRows: 2_000_000,
  maxColumns: 64,
  minSamples: 50,
};
