import { describe, expect, test } from "vitest";
import { correctionCsv, correctionDocument, correctionHeader, type CorrectionContext } from "@/lib/export/correction";

const context: CorrectionContext = {
  runId: "run-1",
  vehicleName: "Brimwold 4",
  capturedOn: "2026-06-01",
  versionNumber: 2,
  siteName: "Harbour wall field",
  verdict: "pass",
  signedOff: null,
  sensorLabels: { compass_a: "board", compass_b: 'mast, "north"' },
};
const W: [[number, number, number], [number, number, number], [number, number, number]] = [
  [1.02, 0.01, -0.003],
  [0.01, 0.98, 0.02],
  [-0.003, 0.02, 1.0],
];
const results = {
  magnetometers: [
    { sensor: "compass_a", ok: true, model: "full", offset: [12.5, -7.25, 20], softIron: W, fieldStrength: 48.9, residualRms: 0.21 },
    { sensor: "compass_b", ok: false, model: null, offset: null, softIron: null, fieldStrength: null, residualRms: null },
  ],
  accelerometers: [
    {
      sensor: "accel_a",
      ok: true,
      offset: [0.1, -0.05, 0.2],
      scale: [1.01, 0.99, 1.0],
      calibration: {
        ok: true,
        model: "axis",
        correctionMatrix: [
          [0.99, 0, 0],
          [0, 1.01, 0],
          [0, 0, 1],
        ],
      },
    },
  ],
};

describe("correctionDocument", () => {
  test("keeps successful fits only, with labels from the run's sensors", () => {
    const doc = correctionDocument(results, context);
    expect(doc.magnetometers.map((m) => m.slot)).toEqual(["compass_a"]);
    expect(doc.magnetometers[0]).toMatchObject({ label: "board", offset: [12.5, -7.25, 20], matrix: W, units: "uT" });
    expect(doc.accelerometers[0].matrix[1][1]).toBe(1.01);
  });
});

describe("correctionCsv", () => {
  test("one row per number, quoting labels that need it, and it round-trips", () => {
    const csv = correctionCsv(correctionDocument(results, context));
    const rows = csv.trim().split("\n");
    expect(rows[0]).toBe("slot,label,quantity,row,column,value,unit");
    // compass_a: 3 offset + 9 matrix + 1 strength; accel_a: 3 offset + 9 matrix.
    expect(rows).toHaveLength(1 + 13 + 12);
    const m01 = rows.find((r) => r.startsWith("compass_a,board,matrix,x,y,"));
    expect(Number(m01!.split(",")[5])).toBe(0.01);
  });
});

describe("correctionHeader", () => {
  test("declares one offset and one matrix per sensor with float literals", () => {
    const header = correctionHeader(correctionDocument(results, context));
    expect(header).toContain("#ifndef LOXODROME_CORRECTION_H");
    expect(header).toMatch(/static const float lox_compass_a_offset\[3\] = \{ 12\.5000000f, -7\.25000000f, 20\.0000000f \};/);
    expect(header).toContain("static const float lox_compass_a_matrix[3][3] = {");
    expect(header).toContain("static const float lox_accel_a_matrix[3][3]");
    expect(header).not.toContain("lox_compass_b_");
    const numbers = [...header.matchAll(/(-?\d+\.\d+(?:e[-+]?\d+)?)f/g)].map((m) => Number(m[1]));
    expect(numbers).toContain(-0.003);
  });
});
