/**
 * The three magnetometer models and the choice between them.
 *
 * - sphere: offset + radius (4 parameters) — no soft iron;
 * - axis: offset + one scale per body axis (6) — soft iron aligned with the axes;
 * - full: offset + symmetric 3x3 (9) — soft iron in any direction, cross-axis terms included.
 *
 * The automatic choice uses the Bayesian information criterion (Schwarz, "Estimating the
 * dimension of a model", Annals of Statistics 1978): BIC = n·ln(RSS/n) + k·ln(n) for n
 * samples, k parameters and residual sum of squares RSS (Gaussian errors). It was preferred
 * to an F-test because it needs no significance level and the nested models are compared
 * in one pass; its ln(n) penalty per parameter keeps a noise-only improvement from
 * selecting a bigger model, while a real soft-iron distortion lowers RSS by far more.
 * Caveat: consecutive samples are correlated, so n overstates the independent information
 * and BIC leans towards the bigger model when the distortion is tiny; that costs little,
 * since the bigger model contains the smaller one.
 */
import { MODEL_PARAMETER_COUNT, fitEllipsoidAlgebraic, type EllipsoidEstimate } from "./ellipsoid-fit";
import { longCaptureSubsample, refineEllipsoid, type RefineOptions } from "./ellipsoid-refine";
import type { MagModel, MagModelCandidate, MagModelChoice } from "./magnetometer-types";
import { selectedCount, type SampleSelection } from "./normal-equations";
import type { Vec3Series } from "./types";

export const MAG_MODELS: MagModel[] = ["sphere", "axis", "full"];

export interface ModelFit {
  estimate: EllipsoidEstimate;
  residualRms: number;
  parameterCount: number;
  samples: number;
  /** BIC; lower is better. */
  score: number;
}

export type ModelFitResult = { ok: true; fit: ModelFit } | { ok: false; detail: string };

/** Bayesian information criterion for n Gaussian residuals with sum of squares rss and k parameters. */
export function bayesianInformationCriterion(rss: number, n: number, k: number): number {
  // A perfect fit (rss = 0) would give −∞; a floor keeps scores comparable and finite.
  const floor = Number.MIN_VALUE * n;
  return n * Math.log(Math.max(rss, floor) / n) + k * Math.log(n);
}

/**
 * Fit one model: algebraic fit for a start (or the given `start`, e.g. the full-sample fit
 * when refitting a bootstrap resample), then geometric refinement. On a long selection the
 * algebraic start comes from the same well-spread subsample the refinement first iterates
 * on (it is only a start: the refinement ends at the optimum over every sample); with
 * `refine.subsample` false both use every sample. Input units are kept throughout.
 */
export function fitMagModel(
  series: Vec3Series,
  model: MagModel,
  selection: SampleSelection = {},
  refine: RefineOptions = {},
  start?: EllipsoidEstimate,
): ModelFitResult {
  let initial = start;
  let options = refine;
  if (!initial || initial.model !== model) {
    const spread = longCaptureSubsample(series, selection, refine);
    const algebraic = spread ? fitEllipsoidAlgebraic(spread.series, model) : fitEllipsoidAlgebraic(series, model, selection);
    if (!algebraic.ok) return algebraic;
    initial = algebraic.estimate;
    if (spread) options = { ...refine, spread };
  }
  const refined = refineEllipsoid(series, initial, selection, options);
  const samples = selectedCount(series, selection);
  const parameterCount = MODEL_PARAMETER_COUNT[model];
  const rss = refined.residualRms * refined.residualRms * samples;
  return {
    ok: true,
    fit: {
      estimate: refined.estimate,
      residualRms: refined.residualRms,
      parameterCount,
      samples,
      score: bayesianInformationCriterion(rss, samples, parameterCount),
    },
  };
}

export interface ModelChoice {
  chosen: ModelFit;
  candidates: ModelFit[];
  reason: string;
}

export type ModelChoiceResult = { ok: true; choice: ModelChoice } | { ok: false; detail: string };

const fmt = (v: number) => (Math.abs(v) >= 100 ? v.toFixed(0) : Math.abs(v) >= 1 ? v.toFixed(2) : v.toPrecision(2));

export function toCandidate(fit: ModelFit): MagModelCandidate {
  return { model: fit.estimate.model, residualRms: fit.residualRms, parameterCount: fit.parameterCount, score: fit.score };
}

/**
 * Fit every model on the same samples and pick one: the forced model when `choice` names
 * one, otherwise the lowest BIC. Fits in `alreadyFitted` (same samples) are reused. The
 * reason is a sentence for the report.
 */
export function chooseMagModel(
  series: Vec3Series,
  choice: MagModelChoice,
  selection: SampleSelection = {},
  alreadyFitted: ModelFit[] = [],
): ModelChoiceResult {
  const candidates: ModelFit[] = [];
  const failures: string[] = [];
  // On a long selection every model starts from the same spread subsample, and a model fitted
  // here takes one polishing step (enough to compare scores); the one chosen is then polished.
  const spread = longCaptureSubsample(series, selection);
  const oneStep = new Set<ModelFit>();
  for (const model of MAG_MODELS) {
    const known = alreadyFitted.find((f) => f.estimate.model === model);
    if (known) {
      candidates.push(known);
      continue;
    }
    const result = fitMagModel(series, model, selection, spread ? { spread, polishSteps: 1 } : {});
    if (result.ok) {
      candidates.push(result.fit);
      if (spread) oneStep.add(result.fit);
    } else failures.push(`${model}: ${result.detail}`);
  }
  if (candidates.length === 0) return { ok: false, detail: failures.join("; ") };
  const settled = (fit: ModelFit): ModelFit => {
    if (!oneStep.has(fit)) return fit;
    const polished = fitMagModel(series, fit.estimate.model, selection, { spread: spread! }, fit.estimate);
    if (!polished.ok) return fit;
    candidates[candidates.indexOf(fit)] = polished.fit;
    return polished.fit;
  };
  const summary = candidates.map((c) => `${c.estimate.model} ${fmt(c.residualRms)}`).join(", ");
  if (choice !== "auto") {
    const found = candidates.find((c) => c.estimate.model === choice);
    const forced = found ? settled(found) : undefined;
    if (!forced) return { ok: false, detail: failures.find((f) => f.startsWith(choice)) ?? `the ${choice} model could not be fitted` };
    return {
      ok: true,
      choice: { chosen: forced, candidates, reason: `The ${choice} model was requested. Residual RMS per model: ${summary}.` },
    };
  }
  const best = settled(candidates.reduce((a, b) => (b.score < a.score ? b : a)));
  const simpler = candidates.filter((c) => c.parameterCount < best.parameterCount);
  const bigger = candidates.filter((c) => c.parameterCount > best.parameterCount);
  let why: string;
  if (simpler.length === 0) {
    why = `the extra parameters of ${bigger.map((c) => c.estimate.model).join(" and ")} did not lower the residual enough to pay for themselves`;
  } else if (bigger.length === 0) {
    why = `its lower residual outweighs the penalty for its extra parameters`;
  } else {
    why = `it pays for its parameters over ${simpler.map((c) => c.estimate.model).join(" and ")}, and ${bigger
      .map((c) => c.estimate.model)
      .join(" and ")} adds parameters without enough gain`;
  }
  const reason =
    `Chosen by the Bayesian information criterion (n·ln(RSS/n) + k·ln n), which weighs the residual against the number of ` +
    `parameters without a significance level to pick: ${best.estimate.model} scores lowest because ${why}. Residual RMS per model: ${summary}.`;
  return { ok: true, choice: { chosen: best, candidates, reason } };
}
