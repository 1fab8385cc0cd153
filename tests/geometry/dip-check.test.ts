import { describe, expect, test } from "vitest";
import { measureDip } from "@/geometry/dip-check";
import type { StillPeriod } from "@/geometry/still-periods";
import type { Mat3, Vec3, Vec3Series } from "@/geometry/types";
import { mulMat, mulMatVec, transpose3 } from "@/geometry/vector";

const d = Math.PI / 180;

function rotation(rollDeg: number, pitchDeg: number, yawDeg: number): Mat3 {
  const [r, p, y] = [rollDeg * d, pitchDeg * d, yawDeg * d];
  const rx: Mat3 = [
    [1, 0, 0],
    [0, Math.cos(r), -Math.sin(r)],
    [0, Math.sin(r), Math.cos(r)],
  ];
  const ry: Mat3 = [
    [Math.cos(p), 0, Math.sin(p)],
    [0, 1, 0],
    [-Math.sin(p), 0, Math.cos(p)],
  ];
  const rz: Mat3 = [
    [Math.cos(y), -Math.sin(y), 0],
    [Math.sin(y), Math.cos(y), 0],
    [0, 0, 1],
  ];
  return mulMat(rz, mulMat(ry, rx)); // body → NED
}

/** Still holds at given attitudes in a field of the given inclination; one sample pair per ten samples. */
function holds(inclinationDeg: number, attitudes: [number, number, number][], fieldInBody?: (b: Vec3) => Vec3) {
  const fieldNed: Vec3 = [50 * Math.cos(inclinationDeg * d), 0, 50 * Math.sin(inclinationDeg * d)];
  const specificForceNed: Vec3 = [0, 0, -9.8];
  const n = attitudes.length * 10;
  const accel: Vec3Series = { x: new Float64Array(n), y: new Float64Array(n), z: new Float64Array(n) };
  const field: Vec3Series = { x: new Float64Array(n), y: new Float64Array(n), z: new Float64Array(n) };
  const periods: StillPeriod[] = [];
  attitudes.forEach(([roll, pitch, yaw], h) => {
    const toBody = transpose3(rotation(roll, pitch, yaw));
    const f = mulMatVec(toBody, specificForceNed);
    const bBody = mulMatVec(toBody, fieldNed);
    const b = fieldInBody ? fieldInBody(bBody) : bBody;
    for (let i = h * 10; i < h * 10 + 10; i++) {
      [accel.x[i], accel.y[i], accel.z[i]] = f;
      [field.x[i], field.y[i], field.z[i]] = b;
    }
    periods.push({ startIndex: h * 10, endIndex: h * 10 + 10, startTimeS: h, endTimeS: h + 0.9, durationS: 0.9 });
  });
  return { accel, field, periods };
}

const attitudes: [number, number, number][] = [
  [0, 0, 0],
  [180, 0, 30],
  [0, 90, 0],
  [0, -90, 120],
  [90, 0, 200],
  [-90, 0, 300],
  [20, 10, 45],
];

describe("measureDip", () => {
  // Inclinations spanning both hemispheres; a perfect capture gives back the site's dip.
  test.each([
    { label: "northern mid-latitude 67°", inclination: 67 },
    { label: "equatorial −15°", inclination: -15 },
    { label: "southern −72°", inclination: -72 },
  ])("recovers the inclination at every attitude: $label", ({ inclination }) => {
    const { accel, field, periods } = holds(inclination, attitudes);
    const result = measureDip(accel, field, periods)!;
    expect(result.dipDeg).toBeCloseTo(inclination, 9);
    expect(result.dipSpreadDeg).toBeLessThan(1e-9);
    expect(result.periods).toHaveLength(attitudes.length);
  });

  test("applies the corrections before measuring", () => {
    const offset: Vec3 = [12, -7, 30];
    const squash: Mat3 = [
      [1.2, 0, 0],
      [0, 0.9, 0],
      [0, 0, 1],
    ];
    const { accel, field, periods } = holds(60, attitudes, (b) => {
      const s = mulMatVec(squash, b);
      return [s[0] + offset[0], s[1] + offset[1], s[2] + offset[2]];
    });
    const raw = measureDip(accel, field, periods)!;
    const inverse: Mat3 = [
      [1 / 1.2, 0, 0],
      [0, 1 / 0.9, 0],
      [0, 0, 1],
    ];
    const corrected = measureDip(accel, field, periods, { field: { offset, matrix: inverse } })!;
    expect(Math.abs(raw.dipDeg - 60)).toBeGreaterThan(1);
    expect(corrected.dipDeg).toBeCloseTo(60, 9);
  });

  test("a compass turned 90° against the accelerometer gives a scattered, wrong dip", () => {
    const { accel, field, periods } = holds(60, attitudes, (b) => [-b[1], b[0], b[2]]);
    const result = measureDip(accel, field, periods)!;
    expect(result.dipSpreadDeg).toBeGreaterThan(10);
  });

  test("no periods: null", () => {
    const { accel, field } = holds(60, attitudes);
    expect(measureDip(accel, field, [])).toBeNull();
  });
});
