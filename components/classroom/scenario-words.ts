/**
 * A scenario's faults in a few words, for its card in the classroom list: the rotation path
 * first, then each fault that is on. Nothing here gives the answer away beyond what the
 * instructor chose; the list is only shown to those who manage scenarios.
 */
import type { ScenarioSpec } from "@/geometry/scenario";
import { mountingRotationById } from "@/geometry/mounting-rotations";
import { PATH_LABELS } from "./scenario-draft";

const norm = (v: [number, number, number]) => Math.hypot(v[0], v[1], v[2]);
const whole = (value: number) => (Math.abs(value) >= 10 ? value.toFixed(0) : value.toFixed(1)).replace("-", "−");

export function scenarioFaultWords(spec: ScenarioSpec): string[] {
  const words = [`${PATH_LABELS[spec.path].label}, ${whole(spec.pathSeconds)} s`];
  const offset = norm(spec.hardIronOffset);
  if (offset > 0) words.push(`hard iron ${whole(offset)} µT`);
  words.push(Array.isArray(spec.softIron) ? "custom soft iron" : spec.softIron === "none" ? "no soft iron" : `${spec.softIron} soft iron`);
  if (spec.noiseMicrotesla >= 1) words.push(`noise ${whole(spec.noiseMicrotesla)} µT`);
  if (spec.secondCompass) {
    const { mountingRotation, declaredRotation } = spec.secondCompass;
    const short = (id: string) => mountingRotationById(id)?.shortWords ?? id;
    words.push(
      mountingRotation === declaredRotation
        ? `second compass (${short(mountingRotation)})`
        : `second compass mounted (${short(mountingRotation)}), declared (${short(declaredRotation)})`,
    );
  }
  if (spec.currentCoupling)
    words.push(`motor run to ${whole(spec.currentCoupling.maxAmps)} A, ${whole(norm(spec.currentCoupling.perAmpMicrotesla))} µT/A`);
  if (spec.clipLevelMicrotesla !== null) words.push(`clips at ±${whole(spec.clipLevelMicrotesla)} µT`);
  if (spec.holds)
    words.push(`${spec.holds.faces.length} hold${spec.holds.faces.length === 1 ? "" : "s"}, wobble ${whole(spec.holds.wobbleDeg)}°`);
  if (spec.steel) words.push(`steel at ${whole(spec.steel.distanceM)} m`);
  if (spec.glitchBurst)
    words.push(
      `${spec.glitchBurst.kind === "stuck" ? "stuck compass" : "magnet carried past"} for ${whole(spec.glitchBurst.durationS)} s at ${whole(spec.glitchBurst.startS)} s`,
    );
  return words;
}
