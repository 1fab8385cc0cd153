/**
 * The server's refusal of a motor run that was not confirmed; which rules come first for
 * the vehicle is in lib/vehicle-words.ts.
 */
import type { VehicleKind } from "@/lib/fleet-terms";
import { localRulesFor } from "@/lib/vehicle-words";
import type { MotorField } from "@/geometry/motor-safety";

/** A column name as it may be quoted back: no control characters, not too long. */
function quoted(header: string): string {
  const clean = header.replace(/[\u0000-\u001f\u007f]+/g, " ").trim();
  return `"${clean.length > 60 ? `${clean.slice(0, 59)}…` : clean}"`;
}

/**
 * Why a motor run is refused without the confirmation, and what to confirm: names the
 * column that made it one.
 */
export function motorRunConfirmationMessage(columns: { header: string; field: MotorField }[], kind?: VehicleKind | string | null): string {
  const meaning = (field: MotorField) => (field === "current" ? "motor current" : "throttle");
  const named = columns.slice(0, 3).map((column) => `${quoted(column.header)} (${meaning(column.field)})`);
  const what =
    columns.length === 0
      ? "The capture logs motor current or throttle, so"
      : columns.length === 1
        ? `The column ${quoted(columns[0].header)} is read as ${meaning(columns[0].field)}, so`
        : `The columns ${named.slice(0, -1).join(", ")} and ${named[named.length - 1]} show that`;
  return `${what} this capture powered the motors. Confirm (safetyAcknowledged: true) that it was made with propellers off, the vehicle restrained, the battery handled as its maker says and people clear, under ${localRulesFor(kind)}, the vehicle maker's manual and licensed practice.`;
}
