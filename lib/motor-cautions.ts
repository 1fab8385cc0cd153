/**
 * The words of the motor-run cautions that depend on the vehicle: which rules come first.
 * Shared by the server (its refusals) and the pages (the caution boxes). A vehicle that
 * flies, or might (an "other" or an unknown kind), answers to aviation rules; a rover or a
 * boat to local rules.
 */
import type { VehicleKind } from "@/lib/fleet-terms";
import type { MotorField } from "@/geometry/motor-safety";

const STAYS_DOWN: ReadonlySet<string> = new Set<VehicleKind>(["rover", "boat"]);

/** True unless the vehicle is known to stay on the ground or the water. */
export function vehicleMayFly(kind: VehicleKind | string | null | undefined): boolean {
  return !kind || !STAYS_DOWN.has(kind);
}

/** "local aviation rules" or "local rules", lower case, to go inside a sentence. */
export function localRulesFor(kind: VehicleKind | string | null | undefined): string {
  return vehicleMayFly(kind) ? "local aviation rules" : "local rules";
}

/** The same with a capital, to start a sentence. */
export function localRulesAtStart(kind: VehicleKind | string | null | undefined): string {
  const words = localRulesFor(kind);
  return words.charAt(0).toUpperCase() + words.slice(1);
}

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
