/**
 * The next orientation to try, in words a person holding the vehicle can follow.
 *
 * Coverage is measured over field directions in the body frame. To fill a gap centred on
 * body direction g, the vehicle must be turned until g points along the Earth's field —
 * towards magnetic north and down at northern mid-latitudes (up in the southern
 * hemisphere), at the inclination (dip) angle below the horizon. So the first sentence names
 * the body direction to aim along the field ("the nose and left side"); the second gives one
 * attitude that does it, said from level with the nose towards magnetic north as a turn,
 * then a pitch, then a roll (the yaw–pitch–roll sequence), rounded to 5° and leaving out
 * steps under 10°. Any turn about the field line keeps g on it, so among those attitudes
 * (searched in 5° steps) the one with the least pitch and roll is offered — a change of
 * heading counts a quarter, being the easiest move for a person holding the vehicle.
 *
 * Assumes the samples are in the body frame (x forward, y right, z down), i.e. the
 * compass's mounting rotation has been applied.
 */
import { fromAxisAngle, minimalRotation, toYawPitchRoll } from "./rotation";
import { sentence, sentences } from "./sentence";
import type { Vec3 } from "./types";
import { DEG, mulMat, normalize } from "./vector";

/** Gaps narrower than this need no further turning (about one coverage cell). */
export const GAP_WORTH_FILLING_DEG = 15;
/** Inclination used when the site's is not known: a typical northern mid-latitude value (from memory). */
export const DEFAULT_INCLINATION_DEG = 60;

const BODY_WORDS: [positive: string, negative: string][] = [
  ["nose", "tail"],
  ["right side", "left side"],
  ["underside", "top"],
];

/**
 * Words for a body-frame direction: the one, two or three body faces it leans towards,
 * strongest first ("the nose", "the top and left side").
 */
export function bodyDirectionWords(direction: Vec3): string {
  const d = normalize(direction);
  const parts = [0, 1, 2]
    .map((axis) => ({ axis, weight: Math.abs(d[axis]) }))
    .sort((a, b) => b.weight - a.weight)
    // A component counts once the direction leans more than about 22° towards that face.
    .filter((p, i) => i === 0 || p.weight > Math.sin(22.5 * DEG))
    .map((p) => BODY_WORDS[p.axis][d[p.axis] >= 0 ? 0 : 1]);
  if (parts.length === 1) return `the ${parts[0]}`;
  return `the ${parts.slice(0, -1).join(", ")} and ${parts[parts.length - 1]}`;
}

const round5 = (deg: number) => Math.round(deg / 5) * 5;

/**
 * Yaw, pitch and roll (degrees, R = Rz·Ry·Rx from level with the nose towards magnetic
 * north) of an attitude that points body direction `target` along the Earth's field of dip
 * `inclinationDeg`. Every turn about the field line keeps the target on it; the one with
 * the least pitch and roll is chosen, a change of heading counting a quarter.
 */
export function suggestAttitude(
  target: Vec3,
  inclinationDeg = DEFAULT_INCLINATION_DEG,
): { yawDeg: number; pitchDeg: number; rollDeg: number } {
  const dip = inclinationDeg * DEG;
  // The field in the magnetic north–east–down frame.
  const field: Vec3 = [Math.cos(dip), 0, Math.sin(dip)];
  const base = minimalRotation(target, field);
  let attitude = toYawPitchRoll(base);
  let cost = Infinity;
  for (let spinDeg = 0; spinDeg < 360; spinDeg += 5) {
    const candidate = toYawPitchRoll(mulMat(fromAxisAngle(field, spinDeg * DEG), base));
    const c = Math.abs(candidate.yawDeg) / 4 + Math.abs(candidate.pitchDeg) + Math.abs(candidate.rollDeg);
    if (c < cost - 1e-9) {
      cost = c;
      attitude = candidate;
    }
  }
  return attitude;
}

/**
 * A sentence or two saying how to turn the vehicle next, for a coverage gap of angular
 * radius `largestGapDeg` centred on body direction `gapCentre`. `inclinationDeg` is the
 * site's dip, positive down. The text is whole sentences, each with one final full stop:
 * callers put it after their own sentences (see `sentences`), never inside one.
 */
export function describeNextOrientation(gapCentre: Vec3, largestGapDeg: number, inclinationDeg = DEFAULT_INCLINATION_DEG): string {
  if (largestGapDeg < GAP_WORTH_FILLING_DEG) {
    return sentence(`No gap wider than ${GAP_WORTH_FILLING_DEG}° is left: the turns so far cover every direction`);
  }
  const vertical = inclinationDeg >= 0 ? "below" : "above";
  const aim =
    `Aim ${bodyDirectionWords(gapCentre)} of the vehicle along the Earth's field ` +
    `(towards magnetic north, about ${Math.abs(round5(inclinationDeg))}° ${vertical} the horizon) ` +
    `to fill a gap about ${Math.round(largestGapDeg)}° in radius`;
  const attitude = suggestAttitude(gapCentre, inclinationDeg);
  const steps: string[] = [];
  const yaw = round5(attitude.yawDeg);
  const pitch = round5(attitude.pitchDeg);
  const roll = round5(attitude.rollDeg);
  if (Math.abs(yaw) >= 10) steps.push(`turn the nose about ${Math.abs(yaw)}° to the ${yaw > 0 ? "right (east)" : "left (west)"}`);
  if (Math.abs(pitch) >= 10) steps.push(`pitch the nose ${pitch > 0 ? "up" : "down"} about ${Math.abs(pitch)}°`);
  if (Math.abs(roll) >= 10) steps.push(`roll about ${Math.abs(roll)}° to the ${roll > 0 ? "right" : "left"}`);
  if (steps.length === 0) return sentences(aim, "Holding it level with the nose towards magnetic north does this");
  const sequence = steps.length === 1 ? steps[0] : `${steps.slice(0, -1).join(", ")}, then ${steps[steps.length - 1]}`;
  return sentences(aim, `For example, from level with the nose towards magnetic north: ${sequence}`);
}
