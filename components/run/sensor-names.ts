/**
 * How the run page names a sensor: the kind and the capture's slot in words ("Compass B"),
 * so it can be matched with the file's columns, and the label the user gave it ("mast module").
 */
import { compareSlots, slotWords } from "@/geometry/sensor-slots";

/** Labels by slot, from the run's sensor slots (`RunDetail.sensors`). */
export function sensorLabelsOf(slots: readonly { slot: string; label: string }[]): Record<string, string> {
  return Object.fromEntries(slots.map(({ slot, label }) => [slot, label]));
}

/** "Compass B · mast module"; "Whole capture" for checks about no one sensor. */
export function sensorName(slot: string | null | undefined, labels: Record<string, string> = {}): string {
  if (!slot) return "Whole capture";
  const base = slotWords(slot);
  const label = labels[slot]?.trim();
  return label ? `${base} · ${label}` : base;
}

/**
 * Order of sensors on the page: compasses, then accelerometers, then gyroscopes, each by
 * letter, and whole-capture checks last.
 */
export function compareSensors(a: string | null | undefined, b: string | null | undefined): number {
  if (!a || !b) return Number(!a) - Number(!b);
  return compareSlots(a, b);
}
