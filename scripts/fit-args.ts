/**
 * The arguments of `npm run fit`, read into the inputs of one capture. A new option is one
 * entry in FIT_OPTIONS and one line in fitInputsOf.
 */
import { parseArgs } from "node:util";
import { parseCaptureDate } from "@/geometry/capture-date";
import type { CaptureUnits } from "@/geometry/capture-units";
import { parseColumnMap } from "@/geometry/column-names";
import type { Site } from "@/geometry/magnetic-reference";
import type { MagModelChoice } from "@/geometry/magnetometer-types";
import { MAGNETOMETER_RANGE_LIMITS_UT } from "@/geometry/magnetometer-range";
import { mountingRotationById } from "@/geometry/mounting-rotations";
import { familyOfSlot } from "@/geometry/sensor-slots";
import { parseUnit } from "@/geometry/units";
import type { CaptureInputs } from "@/lib/ingest/ingest-capture";

export const USAGE =
  "usage: npm run fit -- <file.csv> [--site lat,lon,alt] [--date YYYY-MM-DD] [--units uT[,g,deg/s,ms]] [--model auto|sphere|axis|full] [--map col=field,...] [--mount compass_b=x-right.z-down,...] [--range compass_a=800,...] [--seed N]";

/** Bad arguments: the message, then the usage line, and exit code 2. */
export class UsageError extends Error {}

export const FIT_OPTIONS = {
  site: { type: "string" },
  date: { type: "string" },
  units: { type: "string" },
  model: { type: "string" },
  map: { type: "string" },
  mount: { type: "string" },
  range: { type: "string" },
  seed: { type: "string" },
  help: { type: "boolean", short: "h" },
} as const;

const MODELS: MagModelChoice[] = ["auto", "sphere", "axis", "full"];

/**
 * A value that starts with a minus sign and a digit ("-33.9,151.2,0") is read by parseArgs
 * as an option; it is joined to the option before it ("--site=-33.9,151.2,0"), so that
 * southern and western sites are typed as they are written.
 */
export function joinNegativeValues(argv: readonly string[]): string[] {
  const takesValue = new Set(
    Object.entries(FIT_OPTIONS)
      .filter(([, option]) => option.type === "string")
      .map(([name]) => `--${name}`),
  );
  const out: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const next = argv[i + 1];
    if (takesValue.has(argv[i]) && next !== undefined && /^-\.?\d/.test(next)) {
      out.push(`${argv[i]}=${next}`);
      i += 1;
    } else out.push(argv[i]);
  }
  return out;
}

export function parseSite(text: string): Site {
  const parts = text.split(",").map((part) => part.trim());
  const [lat, lon, alt = "0"] = parts;
  const numbers = [lat, lon, alt].map(Number);
  if (parts.length < 2 || parts.length > 3 || parts.some((p) => p === "") || numbers.some((n) => !Number.isFinite(n))) {
    throw new UsageError(`--site "${text}" should be latitude,longitude[,altitude in metres], e.g. 52.1,5.2,10 or -33.9,151.2,0`);
  }
  if (Math.abs(numbers[0]) > 90) throw new UsageError(`--site latitude ${numbers[0]} is outside −90…90`);
  if (Math.abs(numbers[1]) > 360) throw new UsageError(`--site longitude ${numbers[1]} is outside −180…360`);
  return { latitudeDeg: numbers[0], longitudeDeg: numbers[1], altitudeM: numbers[2] };
}

/** The calendar day as given, checked: the analysis evaluates the model at noon UTC of it. */
export function parseDay(text: string): string {
  if (!parseCaptureDate(text)) throw new UsageError(`--date "${text}" should be a date written YYYY-MM-DD`);
  return text.trim();
}

export function parseUnits(text: string): CaptureUnits {
  const units: CaptureUnits = {};
  for (const item of text
    .split(",")
    .map((s) => s.trim())
    .filter(Boolean)) {
    const spec = parseUnit(item);
    if (!spec)
      throw new UsageError(`--units: "${item}" is not a unit we know (e.g. uT, nT, mG, G, m/s2, g, deg/s, rad/s, ms, mag:counts:0.15)`);
    (units as Record<string, unknown>)[spec.kind] = spec;
  }
  return units;
}

export function parseMounts(text: string): Record<string, string> {
  const mounts: Record<string, string> = {};
  for (const pair of text.split(",").filter((s) => s.trim())) {
    const [sensor, rotation] = pair.split("=").map((s) => s.trim());
    if (familyOfSlot(sensor ?? "") !== "mag" || !rotation) {
      throw new UsageError(`--mount "${pair}" should be compass=mounting, e.g. compass_b=x-right.z-down`);
    }
    if (!mountingRotationById(rotation)) {
      throw new UsageError(
        `--mount "${pair}": "${rotation}" is not one of the 48 mountings; write where the module's x and z axes point, e.g. x-right.z-down, x-forward.z-up, x-forward-right.z-down`,
      );
    }
    mounts[sensor] = rotation;
  }
  return mounts;
}

/** `--range compass_a=800,compass_b=1600`: each compass's full-scale range, ± µT per axis. */
export function parseRanges(text: string): Record<string, number> {
  const ranges: Record<string, number> = {};
  const { min, max } = MAGNETOMETER_RANGE_LIMITS_UT;
  for (const pair of text.split(",").filter((s) => s.trim())) {
    const [sensor, value] = pair.split("=").map((s) => s.trim());
    if (familyOfSlot(sensor ?? "") !== "mag" || !value) {
      throw new UsageError(`--range "${pair}" should be compass=µT, e.g. compass_a=800 for a ±800 µT compass`);
    }
    const range = Number(value);
    if (!/^\d+(\.\d+)?$/.test(value) || !(range >= min && range <= max)) {
      throw new UsageError(`--range "${pair}": the full-scale range should be a number of µT from ${min} to ${max}, e.g. 800`);
    }
    ranges[sensor] = range;
  }
  return ranges;
}

export type FitArgs = { help: true } | { help: false; file: string; inputs: CaptureInputs };

/** Reads the command line; throws a UsageError naming the argument that is wrong. */
export function parseFitArgs(argv: readonly string[]): FitArgs {
  let parsed;
  try {
    parsed = parseArgs({ args: joinNegativeValues(argv), allowPositionals: true, options: FIT_OPTIONS });
  } catch (error) {
    throw new UsageError((error as Error).message);
  }
  const { values, positionals } = parsed;
  if (values.help) return { help: true };
  const file = positionals[0];
  if (!file || positionals.length > 1) throw new UsageError("give exactly one capture file");
  return { help: false, file, inputs: fitInputsOf(values) };
}

function fitInputsOf(values: { [K in keyof typeof FIT_OPTIONS]?: string | boolean }): CaptureInputs {
  const text = (name: keyof typeof FIT_OPTIONS) => (typeof values[name] === "string" ? (values[name] as string) : undefined);
  const model = (text("model") ?? "auto") as MagModelChoice;
  if (!MODELS.includes(model)) throw new UsageError(`--model "${text("model")}" should be auto, sphere, axis or full`);
  let map;
  try {
    map = text("map") ? parseColumnMap(text("map")!) : {};
  } catch (error) {
    throw new UsageError(`--map: ${(error as Error).message}`);
  }
  const seed = text("seed") === undefined ? 1 : Number(text("seed"));
  if (!Number.isInteger(seed)) throw new UsageError(`--seed "${text("seed")}" should be a whole number`);
  return {
    site: text("site") ? parseSite(text("site")!) : null,
    capturedOn: text("date") ? parseDay(text("date")!) : null,
    units: text("units") ? parseUnits(text("units")!) : {},
    model,
    map,
    mountingRotations: text("mount") ? parseMounts(text("mount")!) : {},
    magnetometerRangesUt: text("range") ? parseRanges(text("range")!) : {},
    seed,
  };
}
