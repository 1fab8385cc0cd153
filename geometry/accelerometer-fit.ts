/**
 * Six-face accelerometer calibration: offset and scale per axis (and, when enough
 * independent poses were held, cross-axis misalignment), chosen so that the corrected
 * reading of every pose has the magnitude of local gravity.
 *
 * Sensor model: reading = S·f + offset, where f is the specific force (m/s²) and S the gain
 * matrix (diagonal = per-axis scale; off-diagonal = misalignment). The fit estimates the
 * correction C = S⁻¹, taken symmetric: a magnitude constraint cannot see a rotation of the
 * whole sensor, so the three rotational degrees of freedom are left out (they are the
 * level trim, measured separately from the level pose).
 *
 * Method: a linear least-squares start for the axis model (Σ aₖmₖ² + bₖmₖ = 1, exact for six
 * faces), then Levenberg–Marquardt on the residuals |C(m − offset)| − g (Levenberg 1944,
 * Marquardt 1963). The full model is tried only with at least nine poses and is kept only if
 * its normal matrix is well conditioned.
 */
import { inverse, Matrix, solve, SingularValueDecomposition } from "ml-matrix";
import { ALL_FACES, FACE_WORDS, nearestFace, type AccelerometerPose } from "./accelerometer-poses";
import type { BodyFace } from "./magnetometer-types";
import type { Mat3, Vec3 } from "./types";
import { DEG, EPSILON, inverse3, mulMatVec, norm } from "./vector";

export type AccelModel = "axis" | "full";

export interface CorrectedPose {
  face: BodyFace;
  durationS: number;
  /** Corrected mean specific force, m/s². */
  specificForce: Vec3;
  magnitudeMps2: number;
  /** Angle of the corrected down direction from the face's axis, degrees. */
  angleFromAxisDeg: number;
}

export interface AccelerometerCalibration {
  ok: true;
  model: AccelModel;
  modelReason: string;
  /** Reading at zero specific force, m/s². */
  offset: Vec3;
  /** 1σ uncertainty of the offset from the pose geometry, assuming 0.02 m/s² pose repeatability. */
  offsetSigma: Vec3;
  /** Per-axis gain: a reading of scale·f (1 = ideal). */
  scale: Vec3;
  /** Symmetric correction: f = correctionMatrix · (reading − offset). */
  correctionMatrix: Mat3;
  /** Cross-axis misalignment of each axis pair (xy, xz, yz), degrees; zeros for the axis model. */
  misalignmentDeg: Vec3;
  /** The gravity the poses were fitted to, m/s². */
  gravityMps2: number;
  /** Mean of |reading − offset| over the poses: the gravity the sensor reads before its scale is corrected, m/s². */
  rawGravityMps2: number;
  /** RMS over poses of |corrected| − gravity, m/s² (zero when there are as many poses as parameters). */
  residualRmsMps2: number;
  posesUsed: number;
  correctedPoses: CorrectedPose[];
  /** Attitude of the board during the level hold, from its corrected reading; null without a level pose. */
  levelTrim: { rollDeg: number; pitchDeg: number } | null;
}

export interface AccelerometerRefusal {
  ok: false;
  reason: "too-few-poses" | "degenerate";
  detail: string;
}

export type AccelerometerResult = AccelerometerCalibration | AccelerometerRefusal;

export interface AccelerometerFitOptions {
  /** Local gravity, m/s² (WGS 84 normal gravity at the site); default standard gravity. */
  gravityMps2?: number;
  /** Default "auto": full when the poses support it, axis otherwise. */
  model?: AccelModel | "auto";
}

/** Ratio of smallest to largest singular value of JᵀJ below which the system is numerically singular. */
const CONDITION_LIMIT = 1e-12;
/**
 * How well a hand-held pose's mean is known, m/s² (common practice: a few mg of hold-to-hold
 * repeatability), used to turn the normal matrix into parameter uncertainties.
 */
const POSE_REPEATABILITY_MPS2 = 0.02;
/** Largest 1σ uncertainty accepted for an offset (m/s²) and for a correction term (dimensionless). */
const MAX_OFFSET_SIGMA_MPS2 = 0.1;
const MAX_CORRECTION_SIGMA = 0.01;
const MAX_ITERATIONS = 100;

/** Parameters: offset (3), then C's xx, yy, zz, and for the full model xy, xz, yz. */
function unpack(p: number[], model: AccelModel): { offset: Vec3; c: Mat3 } {
  const [ox, oy, oz, cxx, cyy, czz] = p;
  const [cxy, cxz, cyz] = model === "full" ? [p[6], p[7], p[8]] : [0, 0, 0];
  return {
    offset: [ox, oy, oz],
    c: [
      [cxx, cxy, cxz],
      [cxy, cyy, cyz],
      [cxz, cyz, czz],
    ],
  };
}

function residualsAndJacobian(means: Vec3[], p: number[], model: AccelModel, gravity: number) {
  const { offset, c } = unpack(p, model);
  const count = model === "full" ? 9 : 6;
  const residuals = new Array<number>(means.length);
  const jacobian = new Matrix(means.length, count);
  means.forEach((m, i) => {
    const d: Vec3 = [m[0] - offset[0], m[1] - offset[1], m[2] - offset[2]];
    const u = mulMatVec(c, d);
    const n = Math.max(norm(u), EPSILON);
    residuals[i] = n - gravity;
    const cu = mulMatVec(c, u); // C symmetric: ∂|u|/∂offset = −C·u/|u|
    for (let k = 0; k < 3; k++) jacobian.set(i, k, -cu[k] / n);
    for (let k = 0; k < 3; k++) jacobian.set(i, 3 + k, (u[k] * d[k]) / n);
    if (model === "full") {
      const pairs: [number, number][] = [
        [0, 1],
        [0, 2],
        [1, 2],
      ];
      pairs.forEach(([k, l], j) => jacobian.set(i, 6 + j, (u[k] * d[l] + u[l] * d[k]) / n));
    }
  });
  return { residuals, jacobian };
}

function sumOfSquares(values: number[]): number {
  return values.reduce((total, v) => total + v * v, 0);
}

/** Linear start for the axis model; null when the poses do not determine it. */
function linearAxisStart(means: Vec3[], gravity: number): number[] | null {
  const design = new Matrix(means.map((m) => [m[0] * m[0], m[1] * m[1], m[2] * m[2], m[0], m[1], m[2]]));
  const ones = Matrix.ones(means.length, 1);
  const normal = design.transpose().mmul(design);
  const svd = new SingularValueDecomposition(normal);
  const values = svd.diagonal;
  if (!(Math.min(...values) > CONDITION_LIMIT * Math.max(...values))) return null;
  const solution = solve(normal, design.transpose().mmul(ones)).to1DArray();
  const [ax, ay, az, bx, by, bz] = solution;
  if (!(ax > 0 && ay > 0 && az > 0)) return null;
  const offset = [-bx / (2 * ax), -by / (2 * ay), -bz / (2 * az)];
  const scaleSquared = 1 + ax * offset[0] ** 2 + ay * offset[1] ** 2 + az * offset[2] ** 2;
  if (!(scaleSquared > 0)) return null;
  const factor = (gravity * gravity) / scaleSquared;
  return [...offset, Math.sqrt(ax * factor), Math.sqrt(ay * factor), Math.sqrt(az * factor)];
}

/**
 * Levenberg–Marquardt from `start`. Returns null when the poses leave a parameter
 * undetermined: its uncertainty, σ·√((JᵀJ)⁻¹ₖₖ) with σ the pose repeatability, exceeds the
 * limits above (e.g. no pose with the x axis near vertical both ways).
 */
function refine(means: Vec3[], start: number[], model: AccelModel, gravity: number): { p: number[]; cost: number; sigma: number[] } | null {
  let p = [...start];
  let { residuals, jacobian } = residualsAndJacobian(means, p, model, gravity);
  let cost = sumOfSquares(residuals);
  let lambda = 1e-3;
  for (let iteration = 0; iteration < MAX_ITERATIONS; iteration++) {
    const jt = jacobian.transpose();
    const normal = jt.mmul(jacobian);
    const gradient = jt.mmul(Matrix.columnVector(residuals));
    let improved = false;
    while (lambda < 1e12) {
      const damped = normal.clone();
      for (let k = 0; k < damped.rows; k++) damped.set(k, k, normal.get(k, k) * (1 + lambda) + EPSILON);
      const step = solve(damped, gradient).to1DArray();
      const candidate = p.map((value, k) => value - step[k]);
      const next = residualsAndJacobian(means, candidate, model, gravity);
      const nextCost = sumOfSquares(next.residuals);
      if (nextCost < cost) {
        const relativeDrop = (cost - nextCost) / Math.max(cost, EPSILON);
        p = candidate;
        residuals = next.residuals;
        jacobian = next.jacobian;
        cost = nextCost;
        lambda = Math.max(lambda / 10, 1e-12);
        improved = relativeDrop > 1e-12;
        break;
      }
      lambda *= 10;
    }
    if (!improved) break;
  }
  const normal = jacobian.transpose().mmul(jacobian);
  const values = new SingularValueDecomposition(normal).diagonal;
  if (!(Math.min(...values) > CONDITION_LIMIT * Math.max(...values))) return null;
  const covariance = inverse(normal);
  const sigma = p.map((_, k) => POSE_REPEATABILITY_MPS2 * Math.sqrt(Math.max(0, covariance.get(k, k))));
  const determined = sigma.every((value, k) => value <= (k < 3 ? MAX_OFFSET_SIGMA_MPS2 : MAX_CORRECTION_SIGMA));
  return determined ? { p, cost, sigma } : null;
}

/**
 * Fits an accelerometer from its poses.
 *
 * @param poses still poses from `groupPoses`, readings in m/s².
 * @returns the calibration, or a refusal naming why the poses cannot support one.
 */
export function fitAccelerometer(poses: AccelerometerPose[], options: AccelerometerFitOptions = {}): AccelerometerResult {
  const gravity = options.gravityMps2 ?? 9.80665;
  const requested = options.model ?? "auto";
  const means = poses.map((pose) => pose.meanSpecificForce);
  const faces = new Set(poses.map((pose) => pose.face));
  const missing = ALL_FACES.filter((face) => !faces.has(face));
  const missingWords = missing.map((face) => `${FACE_WORDS[face]} (${face} down)`).join(", ");

  if (means.length < 6) {
    return {
      ok: false,
      reason: "too-few-poses",
      detail: `${means.length} still poses found, at least 6 are needed${missing.length ? `; missing: ${missingWords}` : ""}`,
    };
  }
  const start = linearAxisStart(means, gravity);
  const axis = start && refine(means, start, "axis", gravity);
  if (!axis) {
    return {
      ok: false,
      reason: "degenerate",
      detail: `the poses do not pin down every axis's offset and scale${missing.length ? `; missing: ${missingWords}` : "; hold each face squarely"}`,
    };
  }

  let model: AccelModel = "axis";
  let params = axis.p;
  let sigma = axis.sigma;
  let modelReason = "offset and scale per axis";
  const wantsFull = requested === "full" || requested === "auto";
  if (wantsFull && means.length >= 9) {
    const full = refine(means, [...axis.p, 0, 0, 0], "full", gravity);
    if (full) {
      model = "full";
      params = full.p;
      sigma = full.sigma;
      modelReason = `${means.length} poses determine cross-axis misalignment as well`;
    } else modelReason = "the poses do not determine cross-axis misalignment (hold a few poses between the faces for that)";
  } else if (wantsFull) {
    modelReason = `cross-axis misalignment needs at least 9 distinct poses; ${means.length} were held`;
  }
  return describe(poses, params, sigma, model, modelReason, gravity);
}

function describe(
  poses: AccelerometerPose[],
  p: number[],
  sigma: number[],
  model: AccelModel,
  modelReason: string,
  gravity: number,
): AccelerometerCalibration {
  const { offset, c } = unpack(p, model);
  const gain = inverse3(c);
  const scale: Vec3 = [gain[0][0], gain[1][1], gain[2][2]];
  const misalignmentDeg: Vec3 = [
    Math.asin(Math.max(-1, Math.min(1, gain[0][1] / Math.sqrt(gain[0][0] * gain[1][1])))) / DEG,
    Math.asin(Math.max(-1, Math.min(1, gain[0][2] / Math.sqrt(gain[0][0] * gain[2][2])))) / DEG,
    Math.asin(Math.max(-1, Math.min(1, gain[1][2] / Math.sqrt(gain[1][1] * gain[2][2])))) / DEG,
  ];
  const correctedPoses: CorrectedPose[] = poses.map((pose) => {
    const m = pose.meanSpecificForce;
    const specificForce = mulMatVec(c, [m[0] - offset[0], m[1] - offset[1], m[2] - offset[2]]);
    return {
      face: pose.face,
      durationS: pose.durationS,
      specificForce,
      magnitudeMps2: norm(specificForce),
      angleFromAxisDeg: nearestFace(specificForce).angleFromAxisDeg,
    };
  });
  const rawGravityMps2 =
    poses.reduce((total, pose) => {
      const m = pose.meanSpecificForce;
      return total + Math.hypot(m[0] - offset[0], m[1] - offset[1], m[2] - offset[2]);
    }, 0) / poses.length;
  const residualRmsMps2 = Math.sqrt(correctedPoses.reduce((t, cp) => t + (cp.magnitudeMps2 - gravity) ** 2, 0) / poses.length);
  return {
    ok: true,
    model,
    modelReason,
    offset,
    offsetSigma: [sigma[0], sigma[1], sigma[2]],
    scale,
    correctionMatrix: c,
    misalignmentDeg: model === "full" ? misalignmentDeg : [0, 0, 0],
    gravityMps2: gravity,
    rawGravityMps2,
    residualRmsMps2,
    posesUsed: poses.length,
    correctedPoses,
    levelTrim: levelTrim(correctedPoses),
  };
}

/**
 * Roll and pitch of the board in the level hold, degrees, from the corrected specific force
 * f of the longest level pose: roll = atan2(−f_y, −f_z), pitch = atan2(f_x, √(f_y² + f_z²))
 * (aerospace Euler angles, body frame x forward, y right, z down). If the vehicle stood
 * level, these are the board's mounting trim.
 */
export function levelTrim(corrected: CorrectedPose[]): { rollDeg: number; pitchDeg: number } | null {
  const level = corrected.filter((pose) => pose.face === "+z");
  if (level.length === 0) return null;
  const f = level.reduce((best, pose) => (pose.durationS > best.durationS ? pose : best)).specificForce;
  return {
    rollDeg: Math.atan2(-f[1], -f[2]) / DEG,
    pitchDeg: Math.atan2(f[0], Math.hypot(f[1], f[2])) / DEG,
  };
}
