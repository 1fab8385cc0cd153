/**
 * The correction of a run in three shapes a person or a script can use: JSON, CSV and a C
 * header. The field names are Loxodrome's own. Every shape says how to apply it:
 *   magnetometer:  corrected = matrix · (raw − offset)        (µT)
 *   accelerometer: corrected = matrix · (reading − offset)    (m/s²)
 */
type Vec3 = [number, number, number];
type Mat3 = [Vec3, Vec3, Vec3];

export interface CorrectionContext {
  runId: string;
  vehicleName: string;
  capturedOn: string;
  versionNumber: number;
  siteName: string | null;
  verdict: string | null;
  signedOff: { by: string | null; at: string } | null;
  /** slot → the sensor's label, e.g. { compass_a: "board", compass_b: "mast module" } */
  sensorLabels: Record<string, string>;
}

export interface CorrectionDocument {
  format: "loxodrome-correction";
  formatVersion: 1;
  run: CorrectionContext;
  applyMagnetometer: string;
  applyAccelerometer: string;
  magnetometers: {
    slot: string;
    label: string | null;
    model: string;
    offset: Vec3;
    matrix: Mat3;
    fieldStrength: number;
    residualRms: number;
    units: "uT";
  }[];
  accelerometers: { slot: string; label: string | null; model: string; offset: Vec3; matrix: Mat3; scale: Vec3; units: "m/s2" }[];
}

interface ResultsShape {
  magnetometers?: {
    sensor: string;
    ok: boolean;
    model: string | null;
    offset: Vec3 | null;
    softIron: Mat3 | null;
    fieldStrength: number | null;
    residualRms: number | null;
  }[];
  accelerometers?: {
    sensor: string;
    ok: boolean;
    offset: Vec3 | null;
    scale: Vec3 | null;
    calibration: { ok: boolean; model?: string; correctionMatrix?: Mat3 };
  }[];
}

/** Only fits that succeeded become corrections; a refused compass is left out, not zeroed. */
export function correctionDocument(results: Record<string, unknown>, context: CorrectionContext): CorrectionDocument {
  const r = results as ResultsShape;
  return {
    format: "loxodrome-correction",
    formatVersion: 1,
    run: context,
    applyMagnetometer: "corrected = matrix · (raw − offset), µT",
    applyAccelerometer: "corrected = matrix · (reading − offset), m/s²",
    magnetometers: (r.magnetometers ?? [])
      .filter((m) => m.ok && m.offset && m.softIron)
      .map((m) => ({
        slot: m.sensor,
        label: context.sensorLabels[m.sensor] ?? null,
        model: m.model ?? "unknown",
        offset: m.offset!,
        matrix: m.softIron!,
        fieldStrength: m.fieldStrength ?? 0,
        residualRms: m.residualRms ?? 0,
        units: "uT" as const,
      })),
    accelerometers: (r.accelerometers ?? [])
      .filter((a) => a.ok && a.calibration.ok && a.offset && a.calibration.correctionMatrix)
      .map((a) => ({
        slot: a.sensor,
        label: context.sensorLabels[a.sensor] ?? null,
        model: a.calibration.model ?? "unknown",
        offset: a.offset!,
        matrix: a.calibration.correctionMatrix!,
        scale: a.scale ?? [1, 1, 1],
        units: "m/s2" as const,
      })),
  };
}

const AXES = ["x", "y", "z"] as const;

export function correctionCsv(doc: CorrectionDocument): string {
  const lines = ["slot,label,quantity,row,column,value,unit"];
  const quote = (text: string | null) => (text === null ? "" : /[",\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text);
  const push = (slot: string, label: string | null, quantity: string, row: string, column: string, value: number, unit: string) =>
    lines.push([slot, quote(label), quantity, row, column, String(value), unit].join(","));
  for (const m of doc.magnetometers) {
    m.offset.forEach((v, i) => push(m.slot, m.label, "offset", AXES[i], "", v, "uT"));
    m.matrix.forEach((row, i) => row.forEach((v, j) => push(m.slot, m.label, "matrix", AXES[i], AXES[j], v, "")));
    push(m.slot, m.label, "field_strength", "", "", m.fieldStrength, "uT");
  }
  for (const a of doc.accelerometers) {
    a.offset.forEach((v, i) => push(a.slot, a.label, "offset", AXES[i], "", v, "m/s2"));
    a.matrix.forEach((row, i) => row.forEach((v, j) => push(a.slot, a.label, "matrix", AXES[i], AXES[j], v, "")));
  }
  return lines.join("\n") + "\n";
}

function cNumber(value: number): string {
  const text = value.toPrecision(9);
  return `${text.includes(".") || text.includes("e") ? text : `${text}.0`}f`;
}

/** A self-contained C header: one offset array and one matrix per sensor, in row-major order. */
export function correctionHeader(doc: CorrectionDocument): string {
  const guard = "LOXODROME_CORRECTION_H";
  const out = [
    "/*",
    ` * Loxodrome correction: ${doc.run.vehicleName}, captured ${doc.run.capturedOn}, run ${doc.run.runId}, version ${doc.run.versionNumber}.`,
    ` * Verdict: ${doc.run.verdict ?? "none"}.${doc.run.signedOff ? ` Signed off by ${doc.run.signedOff.by ?? "unknown"} at ${doc.run.signedOff.at}.` : " Not signed off."}`,
    ` * Magnetometers:  corrected = matrix * (raw - offset), microtesla.`,
    ` * Accelerometers: corrected = matrix * (reading - offset), m/s^2.`,
    " */",
    `#ifndef ${guard}`,
    `#define ${guard}`,
    "",
  ];
  const emit = (name: string, label: string | null, offset: Vec3, matrix: Mat3, note: string) => {
    out.push(`/* ${name}${label ? ` (${label})` : ""}: ${note} */`);
    out.push(`static const float lox_${name}_offset[3] = { ${offset.map(cNumber).join(", ")} };`);
    out.push(`static const float lox_${name}_matrix[3][3] = {`);
    matrix.forEach((row, i) => out.push(`    { ${row.map(cNumber).join(", ")} }${i < 2 ? "," : ""}`));
    out.push("};", "");
  };
  for (const m of doc.magnetometers)
    emit(m.slot, m.label, m.offset, m.matrix, `model ${m.model}, field strength ${m.fieldStrength.toFixed(2)} uT`);
  for (const a of doc.accelerometers) emit(a.slot, a.label, a.offset, a.matrix, `model ${a.model}`);
  out.push(`#endif /* ${guard} */`, "");
  return out.join("\n");
}
