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
