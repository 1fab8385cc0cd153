import { describe, expect, test } from "vitest";
import { isCanonicalField, kindOfField, parseColumnMap, recogniseColumns, sensorsInFields } from "@/geometry/column-names";

// Spellings named in the issue and common in logger exports (common practice).
describe("recogniseColumns", () => {
  test.each([
    { label: "mx", header: "mx", field: "compass_a.x" },
    { label: "mag_x", header: "mag_x", field: "compass_a.x" },
    { label: "magX (camelCase)", header: "magX", field: "compass_a.x" },
    { label: "Mag X (uT)", header: "Mag X (uT)", field: "compass_a.x", unit: "uT" },
    { label: "MAG_Y upper case", header: "MAG_Y", field: "compass_a.y" },
    { label: "compass_z", header: "compass_z", field: "compass_a.z" },
    { label: "magnetometer.x", header: "magnetometer.x", field: "compass_a.x" },
    { label: "accel_x", header: "accel_x", field: "accel_a.x" },
    { label: "ax", header: "ax", field: "accel_a.x" },
    { label: "acc_x", header: "acc_x", field: "accel_a.x" },
    { label: "AccY", header: "AccY", field: "accel_a.y" },
    { label: "accel_z_g (trailing unit)", header: "accel_z_g", field: "accel_a.z", unit: "g" },
    { label: "Accel Z [m/s^2]", header: "Accel Z [m/s^2]", field: "accel_a.z", unit: "m/s2" },
    { label: "gyro_x", header: "gyro_x", field: "gyro_a.x" },
    { label: "gx", header: "gx", field: "gyro_a.x" },
    { label: "gyr_z_dps", header: "gyr_z_dps", field: "gyro_a.z", unit: "deg/s" },
    { label: "Gyro Y (rad/s)", header: "Gyro Y (rad/s)", field: "gyro_a.y", unit: "rad/s" },
    { label: "mag_x_mg is milligauss", header: "mag_x_mg", field: "compass_a.x", unit: "mG" },
    { label: "acc_x (mg) is milli-g", header: "acc_x (mg)", field: "accel_a.x", unit: "mg" },
    { label: "current", header: "current", field: "current" },
    { label: "curr", header: "curr", field: "current" },
    { label: "amps", header: "amps", field: "current" },
    { label: "Current (A)", header: "Current (A)", field: "current", unit: "A" },
    { label: "current_ma", header: "current_ma", field: "current", unit: "mA" },
    { label: "throttle", header: "throttle", field: "throttle" },
    { label: "Throttle (%)", header: "Throttle (%)", field: "throttle" },
    { label: "time", header: "time", field: "time" },
    { label: "timestamp", header: "timestamp", field: "time" },
    { label: "t", header: "t", field: "time" },
    { label: "time_ms", header: "time_ms", field: "time", unit: "ms" },
    { label: "time_us", header: "time_us", field: "time", unit: "us" },
    { label: "TimeUS", header: "TimeUS", field: "time", unit: "us" },
    { label: "Time (s)", header: "Time (s)", field: "time", unit: "s" },
    { label: "canonical compass_b.z", header: "compass_b.z", field: "compass_b.z" },
  ])("$label → $field", ({ header, field, unit }) => {
    const result = recogniseColumns([header]);
    expect(result.columns[0].field).toBe(field);
    expect(result.columns[0].unitHint?.unit).toBe(unit);
  });

  test.each([
    { label: "max is not a magnetometer", header: "max" },
    { label: "temperature", header: "temperature" },
    { label: "mode", header: "flight mode" },
    { label: "numbered twice", header: "m1x2" },
  ])("$label is ignored", ({ header }) => {
    const result = recogniseColumns([header]);
    expect(result.columns[0].field).toBeNull();
    expect(result.columns[0].how).toBe("ignored");
  });

  test.each([
    { label: "unnumbered then 2", headers: ["mag_x", "mag2_x"], fields: ["compass_a.x", "compass_b.x"] },
    { label: "compass1 and compass2", headers: ["compass2_x", "compass1_x"], fields: ["compass_b.x", "compass_a.x"] },
    { label: "m2x and mx", headers: ["m2x", "mx"], fields: ["compass_b.x", "compass_a.x"] },
    { label: "compass_a and compass_b", headers: ["mag0_y", "mag1_y"], fields: ["compass_a.y", "compass_b.y"] },
    { label: "numbered after the axis", headers: ["accX1", "accX2"], fields: ["accel_a.x", "accel_b.x"] },
    { label: "families numbered apart", headers: ["mag2_x", "acc2_x"], fields: ["compass_a.x", "accel_a.x"] },
  ])("numbering: $label", ({ headers, fields }) => {
    const result = recogniseColumns(headers);
    expect(result.columns.map((c) => c.field)).toEqual(fields);
  });

  test("the map overrides recognition and takes the field from a recognised column", () => {
    const result = recogniseColumns(["Field A (uT)", "mx", "clock"], { "field a (uT)": "compass_a.x", clock: "time" });
    expect(result.columns.map((c) => c.field)).toEqual(["compass_a.x", null, "time"]);
    expect(result.columns[0].unitHint?.unit).toBe("uT");
    expect(result.conflicts).toEqual([{ field: "compass_a.x", headers: ["Field A (uT)", "mx"] }]);
    expect(result.fieldIndex).toEqual({ "compass_a.x": 0, time: 2 });
  });

  test("the map can drop a column", () => {
    const result = recogniseColumns(["t", "mx"], { mx: "ignore" });
    expect(result.columns[1].field).toBeNull();
  });

  test("two spellings of one field: the first wins, the conflict is reported", () => {
    const result = recogniseColumns(["time", "timestamp"]);
    expect(result.fieldIndex.time).toBe(0);
    expect(result.conflicts).toEqual([{ field: "time", headers: ["time", "timestamp"] }]);
  });

  test("incomplete sensors name the missing axes", () => {
    const result = recogniseColumns(["time", "mx", "my", "mz", "ax", "az"]);
    expect(result.incompleteSensors).toEqual([{ sensor: "accel_a", missing: ["accel_a.y"] }]);
  });

  test("unit hints are keyed by field", () => {
    const result = recogniseColumns(["time_ms", "mag_x (nT)"]);
    expect(result.unitHints.time.unit).toBe("ms");
    expect(result.unitHints["compass_a.x"].unit).toBe("nT");
  });
});

// Header dialects seen in logger exports (common practice): a unit after an underscore or in
// brackets, written as it would be on its own, after camelCase axis letters.
describe("recogniseColumns: units after an underscore or in brackets", () => {
  test.each([
    { header: "compassX_nT", field: "compass_a.x", unit: "nT" },
    { header: "MagY[mG]", field: "compass_a.y", unit: "mG" },
    { header: "accZ_g", field: "accel_a.z", unit: "g" },
    { header: "gyroX_dps", field: "gyro_a.x", unit: "deg/s" },
    { header: "mag_x (uT)", field: "compass_a.x", unit: "uT" },
    { header: "AccelX[m/s^2]", field: "accel_a.x", unit: "m/s2" },
    { header: "magZ_uT", field: "compass_a.z", unit: "uT" },
    { header: "magX_µT", field: "compass_a.x", unit: "uT" },
    { header: "magY_G", field: "compass_a.y", unit: "G" },
    { header: "mag_z_gauss", field: "compass_a.z", unit: "G" },
    { header: "magX_mGauss", field: "compass_a.x", unit: "mG" },
    { header: "accelX_m/s2", field: "accel_a.x", unit: "m/s2" },
    { header: "accY_ms-2", field: "accel_a.y", unit: "m/s2" },
    { header: "gyroY_rad/s", field: "gyro_a.y", unit: "rad/s" },
    { header: "gyroZ_deg/s", field: "gyro_a.z", unit: "deg/s" },
    { header: "gyro_x rad/s", field: "gyro_a.x", unit: "rad/s" },
    { header: "Battery Current_mA", field: "current", unit: "mA" },
  ])("$header → $field in $unit", ({ header, field, unit }) => {
    const result = recogniseColumns([header]);
    expect(result.columns[0].field).toBe(field);
    expect(result.columns[0].unitHint?.unit).toBe(unit);
    expect(result.unitHints[field]?.unit).toBe(unit);
  });

  test("numbered sensors keep their numbers with a unit after them", () => {
    const result = recogniseColumns(["Compass2X_nT", "compassX_nT", "magX1_uT"]);
    expect(result.columns.map((c) => c.field)).toEqual(["compass_c.x", "compass_a.x", "compass_b.x"]);
    expect(result.columns.map((c) => c.unitHint?.unit)).toEqual(["nT", "nT", "uT"]);
  });

  test.each([
    { label: "a word that is no unit after the axis", header: "mag_x_furlongs" },
    { label: "a unit glued to the axis letter", header: "magXuT" },
    { label: "a unit after an unknown name", header: "temperature_degC" },
  ])("$label ($header) is not recognised", ({ header }) => {
    expect(recogniseColumns([header]).columns[0].field).toBeNull();
  });

  test("a unit of the wrong kind for the sensor gives no hint", () => {
    // "dps" is a rate, so it says nothing about a compass column.
    const result = recogniseColumns(["mag_x [dps]"]);
    expect(result.columns[0].field).toBe("compass_a.x");
    expect(result.columns[0].unitHint).toBeNull();
  });

  test("a mapped column keeps the unit written after an underscore", () => {
    const result = recogniseColumns(["chan3_mG"], { chan3_mG: "compass_a.x" });
    expect(result.columns[0].field).toBe("compass_a.x");
    expect(result.columns[0].unitHint?.unit).toBe("mG");
  });
});

describe("parseColumnMap", () => {
  test.each([
    { label: "two pairs", text: "a=compass_a.x,b=time", map: { a: "compass_a.x", b: "time" } },
    { label: "spaces and ignore", text: " Col B = ignore , c=current", map: { "Col B": "ignore", c: "current" } },
    { label: "empty", text: "", map: {} },
  ])("$label", ({ text, map }) => {
    expect(parseColumnMap(text)).toEqual(map);
  });

  test.each([
    { label: "no equals sign", text: "abc", message: /not of the form/ },
    { label: "unknown field", text: "a=magnet", message: /not a field/ },
  ])("refuses $label", ({ text, message }) => {
    expect(() => parseColumnMap(text)).toThrow(message);
  });
});

describe("isCanonicalField", () => {
  test.each([
    { name: "compass_a.x", ok: true },
    { name: "gyro_j.z", ok: true },
    { name: "gyro12.z", ok: false },
    { name: "mag0.x", ok: false },
    { name: "throttle", ok: true },
    { name: "mag.x", ok: false },
    { name: "compass_a.w", ok: false },
  ])("$name → $ok", ({ name, ok }) => {
    expect(isCanonicalField(name)).toBe(ok);
  });
});

describe("kindOfField", () => {
  test.each([
    { field: "compass_b.y", kind: "magnetic" },
    { field: "accel_a.x", kind: "acceleration" },
    { field: "gyro_a.z", kind: "rate" },
    { field: "time", kind: "time" },
    { field: "current", kind: "current" },
    { field: "throttle", kind: null },
  ])("$field → $kind", ({ field, kind }) => {
    expect(kindOfField(field)).toBe(kind);
  });
});

describe("sensorsInFields", () => {
  test("lists sensors by family in letter order", () => {
    expect(sensorsInFields(["compass_b.x", "compass_a.x", "accel_a.y", "gyro_j.z", "gyro_c.z", "time"])).toEqual({
      mag: ["compass_a", "compass_b"],
      accel: ["accel_a"],
      gyro: ["gyro_c", "gyro_j"],
    });
  });
});
