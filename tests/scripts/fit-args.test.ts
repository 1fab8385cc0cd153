import { describe, expect, test } from "vitest";
import { joinNegativeValues, parseFitArgs, UsageError } from "../../scripts/fit-args";

describe("joinNegativeValues", () => {
  test.each([
    { args: ["f.csv", "--site", "-33.9,151.2,0"], joined: ["f.csv", "--site=-33.9,151.2,0"] },
    { args: ["--site", "-.5,10", "f.csv"], joined: ["--site=-.5,10", "f.csv"] },
    { args: ["--seed", "-3", "f.csv"], joined: ["--seed=-3", "f.csv"] },
    // Already joined, positive, or an option after it: left alone.
    { args: ["--site=-33.9,151.2"], joined: ["--site=-33.9,151.2"] },
    { args: ["--site", "40.4,-3.7"], joined: ["--site", "40.4,-3.7"] },
    { args: ["--site", "-h"], joined: ["--site", "-h"] },
    { args: ["--help", "-1"], joined: ["--help", "-1"] },
  ])("$args", ({ args, joined }) => {
    expect(joinNegativeValues(args)).toEqual(joined);
  });
});

describe("parseFitArgs", () => {
  test.each([
    {
      label: "south after a space",
      args: ["f.csv", "--site", "-33.9,151.2,0"],
      site: { latitudeDeg: -33.9, longitudeDeg: 151.2, altitudeM: 0 },
    },
    { label: "south after =", args: ["f.csv", "--site=-33.9,151.2,0"], site: { latitudeDeg: -33.9, longitudeDeg: 151.2, altitudeM: 0 } },
    { label: "west", args: ["--site", "51.5,-0.12", "f.csv"], site: { latitudeDeg: 51.5, longitudeDeg: -0.12, altitudeM: 0 } },
    { label: "south-west", args: ["--site", "-54.8,-68.3,20", "f.csv"], site: { latitudeDeg: -54.8, longitudeDeg: -68.3, altitudeM: 20 } },
  ])("a site $label", ({ args, site }) => {
    const parsed = parseFitArgs(args);
    expect(parsed.help).toBe(false);
    if (!parsed.help) {
      expect(parsed.file).toBe("f.csv");
      expect(parsed.inputs.site).toEqual(site);
    }
  });

  test("the date is kept as the day; units, model, map and mountings are read", () => {
    const parsed = parseFitArgs([
      "f.csv",
      "--date",
      "2026-03-01",
      "--units",
      "nT,g",
      "--model",
      "axis",
      "--map",
      "A=compass_a.x",
      "--mount",
      "compass_b=x-right.z-down",
    ]);
    if (parsed.help) throw new Error("not help");
    expect(parsed.inputs).toMatchObject({
      capturedOn: "2026-03-01",
      units: { magnetic: { unit: "nT" }, acceleration: { unit: "g" } },
      model: "axis",
      map: { A: "compass_a.x" },
      mountingRotations: { compass_b: "x-right.z-down" },
      seed: 1,
    });
  });

  test.each([
    { args: ["f.csv", "--site", "-95,10"], message: /--site latitude -95 is outside/ },
    { args: ["f.csv", "--site", "-33.9"], message: /--site "-33.9" should be latitude,longitude/ },
    { args: ["f.csv", "--date", "2026-02-30"], message: /--date "2026-02-30"/ },
    { args: ["f.csv", "--seed", "-1.5"], message: /--seed "-1.5" should be a whole number/ },
    { args: ["f.csv", "--colour", "red"], message: /--colour/ },
    { args: [], message: /exactly one capture file/ },
  ])("refuses $args by name", ({ args, message }) => {
    expect(() => parseFitArgs(args)).toThrow(UsageError);
    expect(() => parseFitArgs(args)).toThrow(message);
  });

  test("--help", () => {
    expect(parseFitArgs(["--help"])).toEqual({ help: true });
  });
});

describe("--range", () => {
  test("gives each compass its full-scale range in µT", () => {
    const args = parseFitArgs(["capture.csv", "--range", "compass_a=800, compass_b=1600"]);
    expect(args.help).toBe(false);
    if (!args.help) expect(args.inputs.magnetometerRangesUt).toEqual({ compass_a: 800, compass_b: 1600 });
  });

  test.each(["accel_a=800", "compass_a", "compass_a=lots", "compass_a=0", "compass_a=-800", "compass_a=20000"])(
    "refuses %j, naming the argument",
    (value) => {
      expect(() => parseFitArgs(["capture.csv", "--range", value])).toThrow(/--range/);
    },
  );
});
