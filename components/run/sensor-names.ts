/**
 * How the run page names a sensor: the kind in words, the capture's slot ("mag1") so it can
 * be matched with the file's columns, and the label the user gave it ("mast module").
 */

const KIND_BY_PREFIX: Record<string, string> = { mag: "Compass", accel: "Accelerometer", gyro: "Gyroscope" };

/** Labels by slot, from the run's sensor slots (`RunDetail.sensors`). */
export function sensorLabelsOf(slots: readonly { slot: string; label: string }[]): Record<string, string> {
  return Object.fromEntries(slots.map(({ slot, label }) => [slot, label]));
}

/** "Compass mag1 · mast module"; "Whole capture" for checks about no one sensor. */
export function sensorName(slot: string | null | undefined, labels: Record<string, string> = {}): string {
  if (!slot) return "Whole capture";
  const prefix = /^[a-z]+/.exec(slot)?.[0] ?? "";
  const kind = KIND_BY_PREFIX[prefix];
  const base = kind ? `${kind} ${slot}` : slot;
  const label = labels[slot]?.trim();
  return label ? `${base} · ${label}` : base;
}

/**
 * Order of sensors on the page: compasses, then accelerometers, then gyroscopes, each by
 * number, and whole-capture checks last.
 */
export function compareSensors(a: string | null | undefined, b: string | null | undefined): number {
  const rank = (slot: string | null | undefined): [number, number] => {
    if (!slot) return [9, 0];
    const match = /^([a-z]+)(\d*)/.exec(slot);
    const order = ["mag", "accel", "gyro"].indexOf(match?.[1] ?? "");
    return [order === -1 ? 8 : order, Number(match?.[2] || 0)];
  };
  const [ka, na] = rank(a);
  const [kb, nb] = rank(b);
  return ka - kb || na - nb || (a ?? "").localeCompare(b ?? "");
}
