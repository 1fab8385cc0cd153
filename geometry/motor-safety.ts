/**
 * Motor runs: which canonical fields mean the motors were powered while the sensors were
 * logged (motor current or throttle), and the caution every piece of advice about such a
 * test carries. The engine cannot know what kind of vehicle it is looking at, so the rules
 * it defers to are worded for any vehicle.
 */
import type { ColumnRecognition } from "./column-names";
import type { CaptureField } from "./types";

/** Canonical fields whose presence makes a capture a motor run. */
export const MOTOR_FIELDS = ["current", "throttle"] as const;
export type MotorField = (typeof MOTOR_FIELDS)[number];

/**
 * The full caution: propellers off, vehicle restrained, battery handled as its maker says,
 * people clear, and local rules, the maker's manual and licensed practice first.
 */
export const MOTOR_SAFETY_CAUTION =
  "Before any test that powers the motors: propellers off, vehicle restrained, battery handled as its maker says, people clear. Local rules (aviation rules where the vehicle flies), the vehicle maker's manual and licensed practice come first.";

export function isMotorField(field: CaptureField | null | undefined): field is MotorField {
  return field === "current" || field === "throttle";
}

/** The columns of a recognised header that carry motor current or throttle, in file order. */
export function motorColumnsOf(recognition: ColumnRecognition): { header: string; field: MotorField }[] {
  const found: { header: string; field: MotorField }[] = [];
  for (const column of recognition.columns) if (isMotorField(column.field)) found.push({ header: column.header, field: column.field });
  return found;
}

/** True when a table of canonical fields holds motor current or throttle. */
export function hasMotorFields(fields: Iterable<CaptureField>): boolean {
  for (const field of fields) if (isMotorField(field)) return true;
  return false;
}
