/**
 * The scenario builder's form as the person types it: every number kept as the text in its
 * box (so "-" or "1." mid-typing is not lost), every optional fault with an on/off switch that
 * keeps its values while off. `draftFromScenario` fills it from a saved spec; reading it back
 * into a spec, with a message per bad field, is in scenario-draft-read.ts.
 */
import { DEFAULT_SCENARIO, type ScenarioSpec } from "@/geometry/scenario";
import type { BodyFace, GlitchBurstSpec, SoftIronLevel } from "@/geometry/magnetometer-types";
import { SOFT_IRON_LEVELS } from "@/geometry/simulator";
import type { Mat3, Vec3 } from "@/geometry/types";

export type Triple = [string, string, string];
export type SoftIronChoice = SoftIronLevel | "custom";

export interface ScenarioDraft {
  name: string;
  description: string;
  answer: string;
  site: { name: string; latitudeDeg: string; longitudeDeg: string; altitudeM: string };
  date: string;
  seed: string;
  sampleRateHz: string;
  path: ScenarioSpec["path"];
  pathSeconds: string;
  noiseMicrotesla: string;
  hardIronOffset: Triple;
  softIron: SoftIronChoice;
  /** Only the upper triangle is typed; the lower one mirrors it (the distortion is symmetric). */
  softIronMatrix: [Triple, Triple, Triple];
  secondCompass: { on: boolean; mountingRotation: string; declaredRotation: string; hardIronOffset: Triple };
  currentCoupling: { on: boolean; perAmpMicrotesla: Triple; maxAmps: string };
  clip: { on: boolean; levelMicrotesla: string };
  holds: { on: boolean; faces: BodyFace[]; wobbleDeg: string; tiltDeg: string };
  steel: { on: boolean; distanceM: string };
  glitchBurst: { on: boolean; kind: GlitchBurstSpec["kind"]; startS: string; durationS: string; fieldMultiple: string };
}

/** The six faces in the order a person holds them: level, upside down, nose down, nose up, right side, left side. */
export const ALL_FACES: BodyFace[] = ["+z", "-z", "+x", "-x", "+y", "-y"];

export const FACE_LABELS: Record<BodyFace, string> = {
  "+z": "Level",
  "-z": "Upside down",
  "+x": "Nose down",
  "-x": "Nose up",
  "+y": "Right side down",
  "-y": "Left side down",
};

export const PATH_LABELS: Record<ScenarioSpec["path"], { label: string; hint: string }> = {
  full: { label: "Full tumble", hint: "Turned through every orientation, upside down included: the good procedure." },
  "yaw-only": { label: "Yaw only", hint: "Spun flat on the ground: one ring of directions, the classic incomplete rotation." },
  "upper-half": { label: "Upper half only", hint: "Tilted every way but never turned over: half the sphere stays empty." },
  partial: { label: "Random partial", hint: "A few arbitrary turns that stop early: patchy coverage." },
  "steady-spin": {
    label: "Steady spin",
    hint: "Turned slowly round at one steady rate on level ground: gravity never moves, but the vehicle is not still.",
  },
};

export const GLITCH_KIND_LABELS: Record<GlitchBurstSpec["kind"], { label: string; hint: string }> = {
  magnet: { label: "Something magnetic carried past", hint: "A phone, a magnet or a steel tool brought near the compass for a moment." },
  stuck: { label: "Readings stuck at one value", hint: "The sensor repeats one reading, as a loose connector can make it." },
};

export const SOFT_IRON_LABELS: Record<SoftIronChoice, string> = {
  none: "None",
  mild: "Mild",
  strong: "Strong",
  custom: "Custom 3×3",
};

const text = (value: number) => String(value);
const triple = (v: Vec3): Triple => [text(v[0]), text(v[1]), text(v[2])];
const matrix = (m: Mat3): [Triple, Triple, Triple] => [triple(m[0]), triple(m[1]), triple(m[2])];

/** Values an optional fault starts from when it is switched on for the first time. */
const FAULT_STARTS = {
  secondCompass: { mountingRotation: "x-right.z-down", declaredRotation: "x-forward.z-down", hardIronOffset: [4, -3, 6] as Vec3 },
  currentCoupling: { perAmpMicrotesla: [0.35, -0.1, 0.6] as Vec3, maxAmps: 25 },
  clipLevelMicrotesla: 60,
  holds: { faces: ALL_FACES, wobbleDeg: 6, tiltDeg: 3 },
  steel: { distanceM: 1.2 },
  glitchBurst: { kind: "magnet" as const, startS: 30, durationS: 1.5, fieldMultiple: 5 },
};

/** The form filled from a spec (a saved scenario, or the default one for a new scenario). */
export function draftFromScenario(
  spec: ScenarioSpec = DEFAULT_SCENARIO,
  details: { name?: string; description?: string; answer?: string } = {},
): ScenarioDraft {
  const customMatrix = Array.isArray(spec.softIron) ? spec.softIron : SOFT_IRON_LEVELS[spec.softIron === "none" ? "mild" : spec.softIron];
  const second = spec.secondCompass ?? FAULT_STARTS.secondCompass;
  const coupling = spec.currentCoupling ?? FAULT_STARTS.currentCoupling;
  const holds = spec.holds ?? FAULT_STARTS.holds;
  const steel = spec.steel ?? FAULT_STARTS.steel;
  const burst = spec.glitchBurst ?? FAULT_STARTS.glitchBurst;
  return {
    name: details.name ?? "",
    description: details.description ?? "",
    answer: details.answer ?? "",
    site: {
      name: spec.site.name,
      latitudeDeg: text(spec.site.latitudeDeg),
      longitudeDeg: text(spec.site.longitudeDeg),
      altitudeM: text(spec.site.altitudeM),
    },
    date: spec.date,
    seed: text(spec.seed),
    sampleRateHz: text(spec.sampleRateHz),
    path: spec.path,
    pathSeconds: text(spec.pathSeconds),
    noiseMicrotesla: text(spec.noiseMicrotesla),
    hardIronOffset: triple(spec.hardIronOffset),
    softIron: Array.isArray(spec.softIron) ? "custom" : spec.softIron,
    softIronMatrix: matrix(customMatrix),
    secondCompass: {
      on: spec.secondCompass !== null,
      mountingRotation: second.mountingRotation,
      declaredRotation: second.declaredRotation,
      hardIronOffset: triple(second.hardIronOffset),
    },
    currentCoupling: {
      on: spec.currentCoupling !== null,
      perAmpMicrotesla: triple(coupling.perAmpMicrotesla),
      maxAmps: text(coupling.maxAmps),
    },
    clip: { on: spec.clipLevelMicrotesla !== null, levelMicrotesla: text(spec.clipLevelMicrotesla ?? FAULT_STARTS.clipLevelMicrotesla) },
    holds: { on: spec.holds !== null, faces: [...holds.faces], wobbleDeg: text(holds.wobbleDeg), tiltDeg: text(holds.tiltDeg) },
    steel: { on: spec.steel !== null, distanceM: text(steel.distanceM) },
    glitchBurst: {
      on: spec.glitchBurst != null,
      kind: burst.kind,
      startS: text(burst.startS),
      durationS: text(burst.durationS),
      fieldMultiple: text(burst.fieldMultiple),
    },
  };
}

/** Sets a soft-iron entry and its mirror across the diagonal, so the matrix stays symmetric. */
export function setSoftIronEntry(m: [Triple, Triple, Triple], row: number, col: number, value: string): [Triple, Triple, Triple] {
  const next = m.map((r) => [...r]) as [Triple, Triple, Triple];
  next[row][col] = value;
  next[col][row] = value;
  return next;
}

/**
 * The part of the form an API field name ("spec.holds.wobbleDeg") belongs to, as text, so a
 * server's message can be dropped once that part is edited. Names the form does not know fall
 * back to the whole form: any edit clears them.
 */
export function draftPart(draft: ScenarioDraft, key: string): string {
  const [head, group, item] = key.split(".");
  if (head === "name" || head === "description" || head === "answer") return draft[head];
  if (head !== "spec") return JSON.stringify(draft);
  switch (group) {
    case "site":
      return item && item in draft.site ? draft.site[item as keyof ScenarioDraft["site"]] : JSON.stringify(draft.site);
    case "date":
    case "seed":
    case "sampleRateHz":
    case "path":
    case "pathSeconds":
    case "noiseMicrotesla":
      return draft[group];
    case "hardIronOffset":
      return item !== undefined && draft.hardIronOffset[Number(item)] !== undefined
        ? draft.hardIronOffset[Number(item)]
        : draft.hardIronOffset.join(",");
    case "softIron":
      return JSON.stringify([draft.softIron, draft.softIronMatrix]);
    case "secondCompass":
      return JSON.stringify(draft.secondCompass);
    case "currentCoupling":
      return JSON.stringify(draft.currentCoupling);
    case "clipLevelMicrotesla":
      return JSON.stringify(draft.clip);
    case "holds":
      return JSON.stringify(draft.holds);
    case "steel":
      return JSON.stringify(draft.steel);
    case "glitchBurst":
      return JSON.stringify(draft.glitchBurst);
    default:
      return JSON.stringify(draft);
  }
}

const SHOWN_FIELD =
  /^(name|description|answer|spec\.(site\.(name|latitudeDeg|longitudeDeg|altitudeM)|date|seed|sampleRateHz|path|pathSeconds|noiseMicrotesla|hardIronOffset\.[0-2]|softIron(\.[0-2]\.[0-2])?|secondCompass\.(mountingRotation|declaredRotation|hardIronOffset\.[0-2])|currentCoupling\.(perAmpMicrotesla\.[0-2]|maxAmps)|clipLevelMicrotesla|holds\.(faces|wobbleDeg|tiltDeg)|steel\.distanceM|glitchBurst\.(kind|startS|durationS|fieldMultiple)))$/;

/**
 * A field name as the form shows it: a soft-iron entry below the diagonal is shown on its
 * mirror above it. Null for a name no field of the form shows (its message goes in the summary).
 */
export function shownFieldKey(key: string): string | null {
  const lower = /^spec\.softIron\.([0-2])\.([0-2])$/.exec(key);
  const shown = lower && lower[1] > lower[2] ? `spec.softIron.${lower[2]}.${lower[1]}` : key;
  return SHOWN_FIELD.test(shown) ? shown : null;
}
