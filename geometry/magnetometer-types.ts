/**
 * Public result and input types of the magnetometer half of the calibration engine.
 *
 * Where the functions live (all pure, all synchronous):
 * - `calibrateMagnetometer(field, options?)`, `applyCorrection(cal, field)` — calibrate-magnetometer.ts
 * - `relativeRotation(reference, other)` — wahba.ts
 * - `MOUNTING_ROTATIONS`, `mountingRotationById(id)`, `nearestMountingRotation(rotation)` — mounting-rotations.ts
 * - `currentCoupling(field, input, options)` — current-coupling.ts
 * - `simulateCapture(spec)`, `tableToCsv(table)` — simulator.ts
 * - `describeCells(gridResolution)` — sphere-cells.ts (centre and boundary of every coverage cell)
 *
 * Field values keep the units they were given in (µT after E2's unit conversion); every
 * length-like output below (offset, field strength, residual) is in those same units.
 * Frames: body frame x forward, y right, z down.
 */
import type { ColumnTable, Interval95, Mat3, Vec3, Vec3Series } from "./types";

/** sphere: offset + radius (4 parameters); axis: offset + 3 scales (6); full: offset + symmetric 3x3 (9). */
export type MagModel = "sphere" | "axis" | "full";
export type MagModelChoice = MagModel | "auto";

/** Clipping and quantisation findings for one axis of one sensor. */
export interface SaturationAxisReport {
  axis: "x" | "y" | "z";
  min: number;
  max: number;
  /** Samples whose value equals the axis minimum (maximum) exactly. */
  countAtMin: number;
  countAtMax: number;
  /** Longest run of consecutive samples sitting exactly at the minimum (maximum). */
  longestRunAtMin: number;
  longestRunAtMax: number;
  clippedLow: boolean;
  clippedHigh: boolean;
  /** Smallest step between distinct values when the values sit on a grid; null when continuous. */
  quantisationStep: number | null;
  /** quantisationStep as a percentage of (max − min); null when continuous. */
  quantisationStepPercentOfRange: number | null;
  coarseQuantisation: boolean;
}

export interface SaturationReport {
  clipped: boolean;
  coarseQuantisation: boolean;
  axes: [SaturationAxisReport, SaturationAxisReport, SaturationAxisReport];
}

/**
 * Coverage of corrected field directions over equal-area cells (HEALPix-style grid, see
 * sphere-cells.ts). `cellCounts[i]` belongs to cell i of `describeCells(gridResolution)`.
 */
export interface CoverageResult {
  cellCount: number;
  minSamplesPerCell: number;
  /** Fraction (0–1) of cells holding at least minSamplesPerCell samples. */
  coveredFraction: number;
  cellCounts: number[];
  /** Angular radius in degrees of the largest cap of directions holding no sample. */
  largestGapDeg: number;
  /** Unit vector (body frame) at the centre of that cap. */
  gapCentre: Vec3;
  /** Plain words: which way to turn the vehicle next. */
  nextOrientation: string;
  /** Cells per face side of the grid (HEALPix Nside); cellCount = 12·gridResolution². */
  gridResolution: number;
}

/** One coverage cell, for the 3D view and the flat equal-area map. */
export interface SphereCell {
  index: number;
  centre: Vec3;
  /** Closed boundary polygon, unit vectors, counter-clockwise seen from outside; first point not repeated. */
  boundary: Vec3[];
}

export interface MagModelCandidate {
  model: MagModel;
  residualRms: number;
  parameterCount: number;
  /** Bayesian information criterion; lower is better. */
  score: number;
}

/**
 * A successful calibration: `corrected = softIronMatrix · (raw − hardIronOffset)` lies on a
 * sphere of radius fieldStrength. softIronMatrix is symmetric positive definite with
 * determinant 1 (so it preserves volume and fieldStrength is the geometric-mean radius of
 * the raw ellipsoid).
 */
export interface MagnetometerCalibration {
  ok: true;
  model: MagModel;
  modelReason: string;
  hardIronOffset: Vec3;
  softIronMatrix: Mat3;
  fieldStrength: number;
  /** RMS of |corrected| − fieldStrength over the samples used. */
  residualRms: number;
  residualRmsPercent: number;
  /** Half-width of the raw ellipsoid along each body axis divided by fieldStrength (≈1 with little soft iron). */
  scales: Vec3;
  samplesUsed: number;
  /** Usable samples left out of the fit, whether alone or in rejected stretches. */
  outliersRejected: number;
  /** Runs of consecutive rejected samples (glitch bursts), in time order; isolated outliers are not listed. */
  rejectedStretches: RejectedStretch[];
  /** Samples skipped because an axis was NaN or infinite. */
  nonFiniteSkipped: number;
  offsetInterval95: [Interval95, Interval95, Interval95];
  scaleInterval95: [Interval95, Interval95, Interval95];
  /** Bootstrap resamples behind the intervals (0 when they came from the sandwich covariance, or were turned off). */
  bootstrapResamples: number;
  /**
   * Where the 95% intervals come from: "bootstrap" (refits of resamples, bootstrap.ts),
   * "sandwich" (the asymptotic covariance of a long capture, asymptotic-intervals.ts) or
   * "none" (turned off: intervals collapse to the estimate).
   */
  intervalMethod: "bootstrap" | "sandwich" | "none";
  candidates: MagModelCandidate[];
  saturation: SaturationReport;
  coverage: CoverageResult;
}

/** A run of consecutive samples left out of the fit (burst-rejection.ts). */
export interface RejectedStretch {
  /** First sample of the stretch and one past its last (indices into the capture). */
  startIndex: number;
  endIndex: number;
  /** Samples left out within the stretch. */
  samples: number;
  /** Time of the first sample, seconds; null when no time was given. */
  startS: number | null;
  /** Length of the stretch, seconds (one sample period per sample); null when no time was given. */
  durationS: number | null;
  /** Median distance of its readings from the fitted centre, after correction, as a multiple of the fitted field strength. */
  fieldMultiple: number;
}

export type MagnetometerRefusalReason = "too-few-samples" | "planar" | "small-cap" | "non-finite" | "not-an-ellipsoid";

export interface MagnetometerRefusal {
  ok: false;
  reason: MagnetometerRefusalReason;
  detail: string;
  coverage?: CoverageResult;
}

export type MagnetometerResult = MagnetometerCalibration | MagnetometerRefusal;

export interface CalibrateMagnetometerOptions {
  /** Default "auto". */
  model?: MagModelChoice;
  /** Seed of the bootstrap; default 1. */
  seed?: number;
  /** Samples a cell needs to count as covered; default 3. */
  minSamplesPerCell?: number;
  /** Compute 95% intervals (bootstrap, or the sandwich covariance for a long capture); default true. */
  bootstrap?: boolean;
  /**
   * "auto" (default): the sandwich covariance from ASYMPTOTIC_INTERVAL_MIN_SAMPLES kept samples
   * on, the bootstrap below; "bootstrap": always the bootstrap (the reference it is checked against).
   */
  intervals?: "auto" | "bootstrap";
  /** Site inclination (dip) in degrees, positive down, used only to word the next orientation; default 60. */
  inclinationDeg?: number;
  /**
   * Rotation from the logged frame to the body frame (v_body = mountingRotation · v_logged), for
   * a compass that logs in its own axes; used only so that coverage and the next orientation
   * are given in body axes. Default identity (the log is already in the body frame).
   */
  mountingRotation?: Mat3;
  /** Time of each sample, seconds, so rejected stretches can be reported in seconds; without it they are given as sample numbers. */
  time?: Float64Array;
}

/**
 * One of the 48 axis-aligned mountings (mounting-rotations.ts): `v_reference = matrix · v_module`,
 * body frame x forward, y right, z down.
 */
export interface MountingRotation {
  /** Where the module's x and z axes land, e.g. "x-right.z-down". */
  id: string;
  matrix: Mat3;
  /** "module x → vehicle right, module z → down". */
  words: string;
  /** "x → right, z → down". */
  shortWords: string;
  /** Degrees in −180…180 with matrix = Rz(yaw)·Ry(pitch)·Rx(roll). */
  eulerDeg: { roll: number; pitch: number; yaw: number };
}

/** Result of `relativeRotation(reference, other)`: reference ≈ rotation · other. */
export interface RelativeRotationResult {
  rotation: Mat3;
  nearest: MountingRotation;
  /** Angle in degrees between `rotation` and `nearest.matrix`. */
  residualDeg: number;
  /** RMS angle in degrees between reference samples and the rotated other samples. */
  rmsAngleDeg: number;
  /** False when the field directions do not span enough of the sphere to fix all three angles. */
  determined: boolean;
  samplesUsed: number;
}

export type CouplingInputKind = "current" | "throttle";

export interface CurrentCouplingOptions {
  kind: CouplingInputKind;
  /** Earth-field strength in field units; default the magnitude of the zero-input intercept. */
  fieldStrength?: number;
  /** Only samples with mask[i] = 1 are used (e.g. the still window of a motor run). */
  mask?: Uint8Array;
}

export interface CurrentCouplingResult {
  kind: CouplingInputKind;
  /** Field change per ampere (current) or per full throttle (throttle, 0–1), per body axis. */
  slopePerUnit: Vec3;
  slopeMagnitude: number;
  /** Coefficient of determination of each axis's straight-line fit. */
  rSquared: Vec3;
  /** Largest input seen (A, or throttle 0–1 after converting percent). */
  maxInput: number;
  /** slopePerUnit · maxInput. */
  changeAtMax: Vec3;
  changeAtMaxMagnitude: number;
  /** changeAtMaxMagnitude as a percentage of fieldStrength. */
  percentOfField: number;
  fieldStrength: number;
  samplesUsed: number;
}

export type SoftIronLevel = "none" | "mild" | "strong";

/**
 * Rotation paths of a simulated capture; "steady-spin" turns the vehicle level at one steady
 * rate; "none" keeps the vehicle still (e.g. a motor-run capture).
 */
export type RotationPath = "full" | "yaw-only" | "upper-half" | "partial" | "steady-spin" | "none";

/** Which body axis points down during a still hold: "+z" level, "-z" upside down, "+x" nose down, … */
export type BodyFace = "+x" | "-x" | "+y" | "-y" | "+z" | "-z";

export interface SimulatedMagnetometerSpec {
  /** µT, sensor frame. Default [0,0,0]. */
  hardIronOffset?: Vec3;
  /** Symmetric distortion S in raw = S·B + offset, or a level name. Default "none". */
  softIron?: Mat3 | SoftIronLevel;
  /** Standard deviation of white noise per axis, µT. Default 0.2. */
  noise?: number;
  /** Actual mounting: v_body = mountingRotation · v_sensor. Default identity. */
  mountingRotation?: Mat3;
  /** Rotation the logger is told about. Default = mountingRotation. */
  declaredRotation?: Mat3;
  /**
   * Frame of the logged values: "body" (default) — the logger applies the declared rotation,
   * v_logged = declaredRotation · v_sensor; "sensor" — the sensor's own axes are written.
   */
  loggedFrame?: "body" | "sensor";
  /** Field added per ampere, µT/A, body frame. Default none. */
  currentCoupling?: Vec3;
  /** Readings are clamped to ±clipLevel µT per axis. Default none. */
  clipLevel?: number;
  /** Readings are rounded to multiples of this step, µT. Default none. */
  quantisationStep?: number;
  /** Stretches of readings far off the sphere, in a row (see GlitchBurstSpec). Default none. */
  glitchBursts?: GlitchBurstSpec[];
}

/**
 * A stretch of bad readings inside a capture.
 * - "magnet": a strong field fixed in the site frame is added, as when a magnet or a phone is
 *   carried past the vehicle; its direction sweeps 90° about the vertical over the stretch,
 *   so the body-frame disturbance varies slowly as the vehicle turns.
 * - "stuck": the sensor returns one fixed value (a loose connector, a garbage register).
 */
export interface GlitchBurstSpec {
  kind: "magnet" | "stuck";
  /** Start, seconds from the start of the capture. */
  startS: number;
  durationS: number;
  /** Size of the added field ("magnet") or of the fixed value ("stuck") as a multiple of the site field strength. Default 5. */
  fieldMultiple?: number;
  /** Unit direction of the added field (site frame, NED) or of the fixed value (sensor frame). Default an invented one. */
  direction?: Vec3;
}

/** A simulated glitch burst as it was made: samples startIndex (inclusive) to endIndex (exclusive). */
export interface GlitchBurstTruth extends Required<GlitchBurstSpec> {
  startIndex: number;
  endIndex: number;
}

export interface SimulatedHoldsSpec {
  faces: BodyFace[];
  /** Default 4 s. */
  holdSeconds?: number;
  /** Default 3 s. */
  moveSeconds?: number;
  /** Amplitude of hand wobble during holds, degrees. Default 0. */
  wobbleDeg?: number;
  /** Fixed tilt away from the exact face per hold, degrees. Default 0. */
  tiltDeg?: number;
}

export interface CaptureSpec {
  seed?: number;
  /** Default 50 Hz. */
  sampleRateHz?: number;
  /** Length of the rotation path in seconds. Default 60. */
  pathSeconds?: number;
  /** Default "full". */
  path?: RotationPath;
  /** Rate of the steady-spin path, °/s (positive turns clockwise seen from above). Default STEADY_SPIN_RATE_DEG_PER_S. */
  spinRateDegPerS?: number;
  /** Site field in the NED frame, µT. Default an invented mid-latitude value. */
  siteFieldNed?: Vec3;
  /** Gravity magnitude, m/s². Default 9.80665 (standard gravity, CGPM 1901). */
  gravity?: number;
  /** One entry per magnetometer (compass_a, compass_b, …). Default one clean magnetometer. */
  magnetometers?: SimulatedMagnetometerSpec[];
  /** Still holds before the rotation path (the accelerometer procedure). */
  holds?: SimulatedHoldsSpec;
  /** Accelerometer errors: reading = scale ⊙ specificForce + offset + noise. Default a clean one; false for no accel columns. */
  accelerometer?: { offset?: Vec3; scale?: Vec3; noise?: number } | false;
  /** Gyro errors: reading = rate + bias + noise, rad/s. Default a clean one; false for no gyro columns. */
  gyro?: { bias?: Vec3; noise?: number } | false;
  /** A still motor run appended at the end: current rises and falls; current and throttle columns are written. */
  currentTest?: { maxAmps: number; seconds?: number; profile?: "ramp" | "steps" };
  /**
   * A steel object `distanceM` metres east of the capture spot (0.3 m below it): a dipole
   * induced along the site field, of `strength` µT·m³ (default 5, i.e. 5–10 µT at 1 m);
   * the vehicle wanders ±0.3 m while it is turned, so the distortion changes with position.
   */
  steel?: { distanceM: number; strength?: number };
}

export interface CaptureTruthMagnetometer {
  hardIronOffset: Vec3;
  softIronMatrix: Mat3;
  /** The W a perfect fit returns (det 1, symmetric), in the logged frame. */
  expectedSoftIronCorrection: Mat3;
  /** The fieldStrength a perfect fit returns, in the logged frame. */
  expectedFieldStrength: number;
  /** Hard-iron offset as it appears in the logged frame. */
  loggedHardIronOffset: Vec3;
  mountingRotation: Mat3;
  declaredRotation: Mat3;
  /** Rotation from this magnetometer's logged frame to compass_a's logged frame: v_mag0 = r · v_this. */
  rotationToMag0: Mat3;
  loggedFrame: "body" | "sensor";
  currentCoupling: Vec3;
  clipLevel: number | null;
  quantisationStep: number | null;
  noise: number;
  /** Glitch bursts simulated, in the order given. */
  glitchBursts: GlitchBurstTruth[];
}

export interface CaptureTruth {
  siteFieldNed: Vec3;
  fieldStrength: number;
  gravity: number;
  sampleRateHz: number;
  magnetometers: CaptureTruthMagnetometer[];
  accelerometer: { offset: Vec3; scale: Vec3; noise: number } | null;
  gyro: { bias: Vec3; noise: number } | null;
  /** Still holds actually simulated, times in seconds from the start. */
  holds: { face: BodyFace; startS: number; endS: number; tiltDeg: number; wobbleDeg: number }[];
  /** Window of the motor run, seconds, when a current test was simulated. */
  currentWindow: { startS: number; endS: number } | null;
}

export interface SimulatedCapture {
  table: ColumnTable;
  truth: CaptureTruth;
}

export type { Vec3Series };
