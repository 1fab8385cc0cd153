/**
 * Current coupling: how much the field a compass reads moves with motor current (or
 * throttle), from a capture where the vehicle stays still while the motors run — so the
 * Earth's field in the body frame is constant and any change comes from the wiring.
 *
 * Per body axis, ordinary least squares of the corrected field against the input gives a
 * slope (field units per ampere, or per full throttle) and an intercept (the field at zero
 * input). The change at the largest input, as a percentage of the field strength, is the
 * number people compare against a limit.
 *
 * Safety: such a capture spins the motors. Every remedy that advises one carries
 * MOTOR_SAFETY_CAUTION (motor-safety.ts): propellers off, vehicle restrained, battery handled
 * as its maker says, people clear, and local rules, the vehicle maker's manual and licensed
 * practice first.
 */
import type { CurrentCouplingOptions, CurrentCouplingResult } from "./magnetometer-types";
import type { Vec3, Vec3Series } from "./types";
import { EPSILON } from "./vector";

/**
 * Slopes of the corrected field (any units) against current (A) or throttle (0–1; values
 * above 1.5 are taken as percent and divided by 100). Samples with a non-finite value or
 * mask[i] = 0 are skipped. Returns null with fewer than 3 usable samples or no spread in
 * the input.
 */
export function currentCoupling(field: Vec3Series, input: Float64Array, options: CurrentCouplingOptions): CurrentCouplingResult | null {
  const n = Math.min(field.x.length, input.length);
  const { mask } = options;
  let maxRaw = -Infinity;
  for (let i = 0; i < n; i++) if ((!mask || mask[i] !== 0) && Number.isFinite(input[i])) maxRaw = Math.max(maxRaw, input[i]);
  const unitScale = options.kind === "throttle" && maxRaw > 1.5 ? 0.01 : 1;
  const axes = [field.x, field.y, field.z];
  let count = 0;
  let sumI = 0;
  const sumF = [0, 0, 0];
  for (let i = 0; i < n; i++) {
    if (mask && mask[i] === 0) continue;
    const a = input[i] * unitScale;
    if (!Number.isFinite(a) || !Number.isFinite(axes[0][i] + axes[1][i] + axes[2][i])) continue;
    count++;
    sumI += a;
    for (let k = 0; k < 3; k++) sumF[k] += axes[k][i];
  }
  if (count < 3) return null;
  const meanI = sumI / count;
  const meanF = sumF.map((s) => s / count);
  // Centred sums avoid the cancellation of raw sums when the field is large and the change small.
  let sii = 0;
  const sif = [0, 0, 0];
  const sff = [0, 0, 0];
  for (let i = 0; i < n; i++) {
    if (mask && mask[i] === 0) continue;
    const a = input[i] * unitScale;
    if (!Number.isFinite(a) || !Number.isFinite(axes[0][i] + axes[1][i] + axes[2][i])) continue;
    const di = a - meanI;
    sii += di * di;
    for (let k = 0; k < 3; k++) {
      const df = axes[k][i] - meanF[k];
      sif[k] += di * df;
      sff[k] += df * df;
    }
  }
  if (!(sii > EPSILON * Math.max(1, meanI * meanI) * count)) return null;
  const slope = sif.map((s) => s / sii) as Vec3;
  const intercept = meanF.map((m, k) => m - slope[k] * meanI) as Vec3;
  const rSquared = sif.map((s, k) => (sff[k] > 0 ? (s * s) / (sii * sff[k]) : 0)) as Vec3;
  const maxInput = maxRaw * unitScale;
  const changeAtMax = slope.map((s) => s * maxInput) as Vec3;
  const changeAtMaxMagnitude = Math.hypot(...changeAtMax);
  const fieldStrength = options.fieldStrength ?? Math.hypot(...intercept);
  return {
    kind: options.kind,
    slopePerUnit: slope,
    slopeMagnitude: Math.hypot(...slope),
    rSquared,
    maxInput,
    changeAtMax,
    changeAtMaxMagnitude,
    percentOfField: fieldStrength > 0 ? (100 * changeAtMaxMagnitude) / fieldStrength : NaN,
    fieldStrength,
    samplesUsed: count,
  };
}
