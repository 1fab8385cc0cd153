/** Words that depend on what kind of vehicle a calibration is for: shared by server and client code. */
import type { VehicleKind } from "@/lib/fleet-terms";

/** What the vehicle does when it goes out, as the verb of "do not … on this calibration". */
export const GOING_OUT_VERB: Record<VehicleKind, string> = {
  multirotor: "fly",
  "fixed-wing": "fly",
  vtol: "fly",
  rover: "drive",
  boat: "sail",
  other: "operate the vehicle",
};

/** "Do not fly on this calibration", "Do not sail on this calibration", …; an unknown kind gets the words for any vehicle. */
export function doNotGoOutWords(kind: VehicleKind | null | undefined): string {
  return `Do not ${GOING_OUT_VERB[kind ?? "other"] ?? GOING_OUT_VERB.other} on this calibration`;
}

/**
 * Which rules come first for a motor run: a vehicle that flies, or might (an "other" or an
 * unknown kind), answers to aviation rules; a rover or a boat to local rules.
 */
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
