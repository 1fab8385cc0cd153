/**
 * Loxodrome's names for the sensors of one capture. A capture may log several compasses and
 * inertial units; each is a slot named by its family and a letter in the order the file
 * lists them: "compass_a", "compass_b", … for magnetometers, "accel_a" and "gyro_a" for the
 * accelerometer and gyroscope of inertial unit A. A canonical field is a slot and an axis
 * ("compass_b.x"), or one of "time", "current", "throttle".
 *
 * Letters, not numbers: a person reads "Compass B · mast module", and the letters never
 * collide with how a logger numbers its own columns (which may start at 0 or 1).
 */

/** The three families of vector sensors, as the engine keys them internally. */
export type SensorFamily = "mag" | "accel" | "gyro";
export const SENSOR_FAMILIES: readonly SensorFamily[] = ["mag", "accel", "gyro"];

/** The stem of each family's slot names. */
export const SLOT_STEMS: Record<SensorFamily, string> = { mag: "compass", accel: "accel", gyro: "gyro" };

/** Slots per family a capture may carry: a to j. */
export const SLOT_LETTERS = "abcdefghij";
export const MAX_SLOTS_PER_FAMILY = SLOT_LETTERS.length;

const FAMILY_OF_STEM: Record<string, SensorFamily> = { compass: "mag", accel: "accel", gyro: "gyro" };

/** A slot name: "compass_a", "accel_b". */
export const SLOT_PATTERN = /^(compass|accel|gyro)_([a-j])$/;
/** A canonical field of a vector sensor: "compass_a.x". */
export const SLOT_FIELD_PATTERN = /^(compass|accel|gyro)_([a-j])\.([xyz])$/;

/** The slot of the `index`-th (from 0) sensor of a family. */
export function slotName(family: SensorFamily, index: number): string {
  if (!Number.isInteger(index) || index < 0 || index >= MAX_SLOTS_PER_FAMILY) {
    throw new RangeError(`a capture holds at most ${MAX_SLOTS_PER_FAMILY} sensors of one kind`);
  }
  return `${SLOT_STEMS[family]}_${SLOT_LETTERS[index]}`;
}

/** The family and position of a slot name, or null when it is not one. */
export function parseSlot(slot: string): { family: SensorFamily; index: number } | null {
  const match = SLOT_PATTERN.exec(slot);
  if (!match) return null;
  return { family: FAMILY_OF_STEM[match[1]], index: SLOT_LETTERS.indexOf(match[2]) };
}

/** The slot and axis of a canonical vector field ("compass_b.z"), or null. */
export function parseSlotField(field: string): { slot: string; family: SensorFamily; index: number; axis: "x" | "y" | "z" } | null {
  const match = SLOT_FIELD_PATTERN.exec(field);
  if (!match) return null;
  return {
    slot: `${match[1]}_${match[2]}`,
    family: FAMILY_OF_STEM[match[1]],
    index: SLOT_LETTERS.indexOf(match[2]),
    axis: match[3] as "x" | "y" | "z",
  };
}

/** The family of a slot name, or null. */
export function familyOfSlot(slot: string): SensorFamily | null {
  return parseSlot(slot)?.family ?? null;
}

const FAMILY_WORDS: Record<SensorFamily, string> = { mag: "Compass", accel: "Accelerometer", gyro: "Gyroscope" };

/** "Compass B", "Accelerometer A"; the text itself when it is not a slot name. */
export function slotWords(slot: string): string {
  const parsed = parseSlot(slot);
  if (!parsed) return slot;
  return `${FAMILY_WORDS[parsed.family]} ${SLOT_LETTERS[parsed.index].toUpperCase()}`;
}

/** Order of slots: compasses, accelerometers, gyroscopes, each by letter; anything else after. */
export function compareSlots(a: string, b: string): number {
  const rank = (slot: string) => {
    const parsed = parseSlot(slot);
    return parsed ? SENSOR_FAMILIES.indexOf(parsed.family) * MAX_SLOTS_PER_FAMILY + parsed.index : 1000;
  };
  return rank(a) - rank(b) || a.localeCompare(b);
}

/** The help text that lists the canonical fields. */
export const FIELD_NAMES_HELP = "time, current, throttle, compass_a.x|y|z (compass_b, …), accel_a.x|y|z or gyro_a.x|y|z";
