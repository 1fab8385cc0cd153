import { describe, expect, test } from "vitest";
import { draftFromScenario, draftPart, setSoftIronEntry, shownFieldKey, type ScenarioDraft } from "@/components/classroom/scenario-draft";
import { isCalendarDate, isPositiveDefinite, readScenarioBody, readScenarioSpec } from "@/components/classroom/scenario-draft-read";
import { DEFAULT_SCENARIO, type ScenarioSpec } from "@/geometry/scenario";
import { scenarioSpecSchema } from "@/lib/validations/classroom";
import type { Mat3 } from "@/geometry/types";

// Invented scenarios (demo values), chosen to switch every optional fault on.
const EVERY_FAULT: ScenarioSpec = {
  ...DEFAULT_SCENARIO,
  path: "upper-half",
  softIron: [
    [1.1, 0.05, 0],
    [0.05, 0.92, -0.02],
    [0, -0.02, 1],
  ],
  secondCompass: { mountingRotation: "x-forward-right.z-up", declaredRotation: "x-forward.z-down", hardIronOffset: [1, -2, 3.5] },
  currentCoupling: { perAmpMicrotesla: [0.4, 0, -0.25], maxAmps: 30 },
  clipLevelMicrotesla: 55,
  holds: { faces: ["+z", "-z", "+x"], wobbleDeg: 5, tiltDeg: 2 },
  steel: { distanceM: 0.8 },
  glitchBurst: { kind: "stuck", startS: 100, durationS: 2, fieldMultiple: 6 },
};

function edit(change: (d: ScenarioDraft) => void, spec: ScenarioSpec = DEFAULT_SCENARIO): ScenarioDraft {
  const draft = draftFromScenario(spec, { name: "Flat spin", answer: "The vehicle was only spun flat." });
  change(draft);
  return draft;
}

describe("draftFromScenario and readScenarioSpec", () => {
  test.each([
    ["the default scenario", DEFAULT_SCENARIO],
    ["every fault switched on", EVERY_FAULT],
    ["a named soft-iron level", { ...DEFAULT_SCENARIO, softIron: "strong" as const }],
    ["a steady spin", { ...DEFAULT_SCENARIO, path: "steady-spin" as const }],
    [
      "a magnet carried past",
      { ...DEFAULT_SCENARIO, glitchBurst: { kind: "magnet" as const, startS: 12.5, durationS: 0.4, fieldMultiple: 3 } },
    ],
  ])("round trip: %s", (_label, spec) => {
    expect(readScenarioSpec(draftFromScenario(spec))).toEqual({ spec, errors: {} });
  });

  test("a fault switched off reads as null but keeps its values for switching on again", () => {
    const draft = draftFromScenario(EVERY_FAULT);
    draft.secondCompass.on = false;
    draft.steel.on = false;
    const { spec } = readScenarioSpec(draft);
    expect(spec?.secondCompass).toBeNull();
    expect(spec?.steel).toBeNull();
    draft.secondCompass.on = true;
    expect(readScenarioSpec(draft).spec?.secondCompass).toEqual(EVERY_FAULT.secondCompass);
  });

  test("switching a fault on for the first time starts from sensible values that read without errors", () => {
    const draft = draftFromScenario(DEFAULT_SCENARIO);
    draft.secondCompass.on = draft.currentCoupling.on = draft.clip.on = draft.holds.on = draft.steel.on = draft.glitchBurst.on = true;
    draft.softIron = "custom";
    expect(readScenarioSpec(draft).errors).toEqual({});
  });
});

test("a scenario saved before glitch bursts existed opens with the burst off and saves it as none", () => {
  const { glitchBurst: _, ...saved } = DEFAULT_SCENARIO;
  const draft = draftFromScenario(saved);
  expect(draft.glitchBurst.on).toBe(false);
  expect(readScenarioSpec(draft).spec?.glitchBurst).toBeNull();
});

describe("readScenarioSpec: one message per bad field, under the API's field names", () => {
  test.each([
    ["latitude beyond the pole", (d: ScenarioDraft) => (d.site.latitudeDeg = "91"), "spec.site.latitudeDeg", /between -90° and 90°/],
    ["empty longitude", (d: ScenarioDraft) => (d.site.longitudeDeg = " "), "spec.site.longitudeDeg", /Give a number/],
    ["words for altitude", (d: ScenarioDraft) => (d.site.altitudeM = "high"), "spec.site.altitudeM", /not a number/],
    ["no site name", (d: ScenarioDraft) => (d.site.name = ""), "spec.site.name", /Name the site/],
    ["a date that does not exist", (d: ScenarioDraft) => (d.date = "2026-02-30"), "spec.date", /YYYY-MM-DD/],
    ["a date far outside the models", (d: ScenarioDraft) => (d.date = "2019-12-31"), "spec.date", /between 2020 and 2035/],
    ["a fractional seed", (d: ScenarioDraft) => (d.seed = "1.5"), "spec.seed", /whole number/],
    ["too slow a logger", (d: ScenarioDraft) => (d.sampleRateHz = "2"), "spec.sampleRateHz", /between 5 Hz and 200 Hz/],
    [
      "too long a capture",
      (d: ScenarioDraft) => ((d.sampleRateHz = "200"), (d.pathSeconds = "301")),
      "spec.sampleRateHz",
      /60,200 samples/,
    ],
    ["negative noise", (d: ScenarioDraft) => (d.noiseMicrotesla = "-1"), "spec.noiseMicrotesla", /between 0 µT/],
    ["one offset axis out of range", (d: ScenarioDraft) => (d.hardIronOffset[2] = "900"), "spec.hardIronOffset.2", /600 µT/],
    [
      "custom soft iron with a tiny diagonal",
      (d: ScenarioDraft) => ((d.softIron = "custom"), (d.softIronMatrix[1][1] = "0.1")),
      "spec.softIron.1.1",
      /0.5/,
    ],
    [
      "custom soft iron that is not positive definite",
      (d: ScenarioDraft) => {
        d.softIron = "custom";
        // Leading minors 0.5, 0.16, −0.064 (by hand): the last is negative.
        d.softIronMatrix = [
          ["0.5", "0.3", "-0.3"],
          ["0.3", "0.5", "0.3"],
          ["-0.3", "0.3", "0.5"],
        ];
      },
      "spec.softIron",
      /folds space/,
    ],
    [
      "an unknown mounting (both axes forward)",
      (d: ScenarioDraft) => ((d.secondCompass.on = true), (d.secondCompass.mountingRotation = "x-forward.z-forward")),
      "spec.secondCompass.mountingRotation",
      /x-forward\.z-forward.*48 mountings/,
    ],
    [
      "coupling beyond 5 µT/A",
      (d: ScenarioDraft) => ((d.currentCoupling.on = true), (d.currentCoupling.perAmpMicrotesla[0] = "9")),
      "spec.currentCoupling.perAmpMicrotesla.0",
      /µT\/A/,
    ],
    [
      "no current at all",
      (d: ScenarioDraft) => ((d.currentCoupling.on = true), (d.currentCoupling.maxAmps = "0")),
      "spec.currentCoupling.maxAmps",
      /between 1 A/,
    ],
    [
      "a clip level below any field",
      (d: ScenarioDraft) => ((d.clip.on = true), (d.clip.levelMicrotesla = "3")),
      "spec.clipLevelMicrotesla",
      /between 10 µT/,
    ],
    ["holds with no face", (d: ScenarioDraft) => ((d.holds.on = true), (d.holds.faces = [])), "spec.holds.faces", /at least one face/],
    ["a violent wobble", (d: ScenarioDraft) => ((d.holds.on = true), (d.holds.wobbleDeg = "45")), "spec.holds.wobbleDeg", /and 20°/],
    ["steel touching the vehicle", (d: ScenarioDraft) => ((d.steel.on = true), (d.steel.distanceM = "0")), "spec.steel.distanceM", /0.2 m/],
    [
      "a burst before the capture starts",
      (d: ScenarioDraft) => ((d.glitchBurst.on = true), (d.glitchBurst.startS = "-2")),
      "spec.glitchBurst.startS",
      /0 s or more/,
    ],
    [
      "a burst too brief",
      (d: ScenarioDraft) => ((d.glitchBurst.on = true), (d.glitchBurst.durationS = "0.05")),
      "spec.glitchBurst.durationS",
      /between 0.1 s and 4 s/,
    ],
    [
      "a burst too faint to leave the sphere",
      (d: ScenarioDraft) => ((d.glitchBurst.on = true), (d.glitchBurst.fieldMultiple = "1")),
      "spec.glitchBurst.fieldMultiple",
      /between 1.5 and 20/,
    ],
    [
      "a burst running past the end of the default 90 s capture",
      (d: ScenarioDraft) => ((d.glitchBurst.on = true), (d.glitchBurst.startS = "89"), (d.glitchBurst.durationS = "2")),
      "spec.glitchBurst.startS",
      /end of the 90 s capture/,
    ],
  ])("%s", (_label, change, key, message) => {
    const { spec, errors } = readScenarioSpec(edit(change));
    expect(spec).toBeNull();
    expect(Object.keys(errors)).toEqual([key]);
    expect(errors[key]).toMatch(message);
  });

  test("a fault switched off is not checked", () => {
    const draft = edit((d) => ((d.steel.on = false), (d.steel.distanceM = "nonsense")));
    expect(readScenarioSpec(draft).errors).toEqual({});
  });
});

describe("readScenarioBody", () => {
  test("needs a name and an answer besides a good spec", () => {
    const { body, errors } = readScenarioBody(edit((d) => ((d.name = "  "), (d.answer = ""))));
    expect(body).toBeNull();
    expect(Object.keys(errors).sort()).toEqual(["answer", "name"]);
  });

  test("trims the words and carries the spec", () => {
    const { body } = readScenarioBody(edit((d) => ((d.name = "  Flat spin "), (d.description = " Spun on a table. "))));
    expect(body).toEqual({
      name: "Flat spin",
      description: "Spun on a table.",
      answer: "The vehicle was only spun flat.",
      spec: DEFAULT_SCENARIO,
    });
  });
});

describe("setSoftIronEntry", () => {
  test("writes the entry and its mirror, leaving the original alone", () => {
    const before = draftFromScenario(EVERY_FAULT).softIronMatrix;
    const after = setSoftIronEntry(before, 0, 2, "0.07");
    expect(after[0][2]).toBe("0.07");
    expect(after[2][0]).toBe("0.07");
    expect(before[0][2]).toBe("0");
  });
});

describe("isPositiveDefinite", () => {
  // Small matrices checkable by hand (Sylvester's criterion).
  test.each<[string, Mat3, boolean]>([
    [
      "identity",
      [
        [1, 0, 0],
        [0, 1, 0],
        [0, 0, 1],
      ],
      true,
    ],
    [
      "mild distortion",
      [
        [1.03, 0.015, -0.01],
        [0.015, 0.98, 0.02],
        [-0.01, 0.02, 1.01],
      ],
      true,
    ],
    [
      "a negative axis",
      [
        [1, 0, 0],
        [0, -1, 0],
        [0, 0, 1],
      ],
      false,
    ],
    [
      "singular: two equal rows",
      [
        [1, 1, 0],
        [1, 1, 0],
        [0, 0, 1],
      ],
      false,
    ],
  ])("%s → %s", (_label, m, expected) => {
    expect(isPositiveDefinite(m)).toBe(expected);
  });
});

describe("isCalendarDate", () => {
  test.each([
    ["an ordinary day", "2026-10-01", true],
    ["29 February of a leap year", "2028-02-29", true],
    ["29 February of a common year", "2026-02-29", false],
    ["no day", "2026-10", false],
    ["another format", "01/10/2026", false],
  ])("%s (%s) → %s", (_label, value, expected) => {
    expect(isCalendarDate(value)).toBe(expected);
  });
});

describe("draftPart", () => {
  const draft = draftFromScenario(EVERY_FAULT, { name: "Steel shed" });
  test.each([
    ["the name", "name", "Steel shed"],
    ["a site coordinate", "spec.site.latitudeDeg", String(EVERY_FAULT.site.latitudeDeg)],
    ["one offset axis", "spec.hardIronOffset.1", String(EVERY_FAULT.hardIronOffset[1])],
    ["the path", "spec.path", "upper-half"],
  ])("%s (%s)", (_label, key, expected) => {
    expect(draftPart(draft, key)).toBe(expected);
  });

  test.each([
    ["a holds field changes with the wobble", "spec.holds.wobbleDeg", (d: ScenarioDraft) => (d.holds.wobbleDeg = "7"), true],
    ["a holds field does not change with the name", "spec.holds.wobbleDeg", (d: ScenarioDraft) => (d.name = "Other"), false],
    ["an unknown field changes with anything", "spec.somethingNew", (d: ScenarioDraft) => (d.name = "Other"), true],
  ])("%s", (_label, key, change, changes) => {
    const edited = structuredClone(draft);
    change(edited);
    expect(draftPart(edited, key) !== draftPart(draft, key)).toBe(changes);
  });
});

describe("shownFieldKey", () => {
  test.each([
    ["a field the form shows", "spec.site.altitudeM", "spec.site.altitudeM"],
    ["a soft-iron entry below the diagonal, on its mirror", "spec.softIron.2.0", "spec.softIron.0.2"],
    ["the whole soft-iron matrix", "spec.softIron", "spec.softIron"],
    ["the whole spec", "spec", null],
    ["a field the form does not have", "spec.steel.strength", null],
    ["the glitch burst's start", "spec.glitchBurst.startS", "spec.glitchBurst.startS"],
  ])("%s", (_label, key, expected) => {
    expect(shownFieldKey(key)).toBe(expected);
  });
});

describe("readScenarioSpec agrees with the server's schema (lib/validations/classroom.ts)", () => {
  // Each limit just inside and just outside; the two must accept and refuse the same specs.
  const at = (change: Partial<ScenarioSpec>): ScenarioSpec => ({ ...EVERY_FAULT, ...change });
  test.each<[string, ScenarioSpec]>([
    ["every fault on", EVERY_FAULT],
    ["the default", DEFAULT_SCENARIO],
    ["seed 0", at({ seed: 0 })],
    ["first date", at({ date: "2020-01-01" })],
    ["before the first date", at({ date: "2019-12-31" })],
    ["last date", at({ date: "2035-12-31" })],
    ["after the last date", at({ date: "2036-01-01" })],
    ["slowest logger", at({ sampleRateHz: 5 })],
    ["too slow a logger", at({ sampleRateHz: 4.9 })],
    ["fastest logger, short rotation", { ...DEFAULT_SCENARIO, sampleRateHz: 200, pathSeconds: 300 }],
    ["too fast a logger", { ...DEFAULT_SCENARIO, sampleRateHz: 201, pathSeconds: 60 }],
    ["most samples", { ...DEFAULT_SCENARIO, sampleRateHz: 100, pathSeconds: 600 }],
    ["too many samples with holds and a motor run", at({ sampleRateHz: 100, pathSeconds: 560 })],
    ["noisiest", at({ noiseMicrotesla: 5 })],
    ["too noisy", at({ noiseMicrotesla: 5.1 })],
    ["largest offset", at({ hardIronOffset: [600, -600, 0] })],
    ["too large an offset", at({ hardIronOffset: [601, 0, 0] })],
    [
      "soft-iron diagonal 2",
      at({
        softIron: [
          [2, 0, 0],
          [0, 1, 0],
          [0, 0, 1],
        ],
      }),
    ],
    [
      "soft-iron diagonal above 2",
      at({
        softIron: [
          [2.1, 0, 0],
          [0, 1, 0],
          [0, 0, 1],
        ],
      }),
    ],
    [
      "soft-iron cross term 0.5",
      at({
        softIron: [
          [1, 0.5, 0],
          [0.5, 1, 0],
          [0, 0, 1],
        ],
      }),
    ],
    [
      "soft-iron cross term above 0.5",
      at({
        softIron: [
          [1, 0.51, 0],
          [0.51, 1, 0],
          [0, 0, 1],
        ],
      }),
    ],
    [
      "soft iron squashed flat",
      at({
        softIron: [
          [0.5, 0, 0],
          [0, 0.5, 0],
          [0, 0, 0.9],
        ],
      }),
    ],
    ["most current", at({ currentCoupling: { perAmpMicrotesla: [5, -5, 0], maxAmps: 200 } })],
    ["too much current", at({ currentCoupling: { perAmpMicrotesla: [1, 0, 0], maxAmps: 201 } })],
    ["highest clip level", at({ clipLevelMicrotesla: 5000 })],
    ["clip level too low", at({ clipLevelMicrotesla: 9 })],
    ["most tilt", at({ holds: { faces: ["+z"], wobbleDeg: 20, tiltDeg: 30 } })],
    ["too much wobble", at({ holds: { faces: ["+z"], wobbleDeg: 21, tiltDeg: 0 } })],
    ["steel closest", at({ steel: { distanceM: 0.2 } })],
    ["steel too close", at({ steel: { distanceM: 0.19 } })],
    ["altitude too high", at({ site: { ...EVERY_FAULT.site, altitudeM: 9001 } })],
    ["a steady spin", at({ path: "steady-spin" })],
    // EVERY_FAULT lasts 90 s + 3 holds of 7 s + a 23 s motor run = 134 s.
    ["burst ending with the capture", at({ glitchBurst: { kind: "magnet", startS: 124, durationS: 10, fieldMultiple: 20 } })],
    ["burst ending after the capture", at({ glitchBurst: { kind: "magnet", startS: 124.1, durationS: 10, fieldMultiple: 20 } })],
    ["shortest burst at the start", at({ glitchBurst: { kind: "stuck", startS: 0, durationS: 0.1, fieldMultiple: 1.5 } })],
    ["burst before the start", at({ glitchBurst: { kind: "stuck", startS: -0.1, durationS: 1, fieldMultiple: 4 } })],
    ["burst too brief", at({ glitchBurst: { kind: "stuck", startS: 5, durationS: 0.09, fieldMultiple: 4 } })],
    ["burst too long", at({ glitchBurst: { kind: "stuck", startS: 5, durationS: 4.1, fieldMultiple: 4 } })],
    ["burst too small", at({ glitchBurst: { kind: "magnet", startS: 5, durationS: 1, fieldMultiple: 1.4 } })],
    ["burst too large", at({ glitchBurst: { kind: "magnet", startS: 5, durationS: 1, fieldMultiple: 20.1 } })],
  ])("%s", (_label, spec) => {
    const server = scenarioSpecSchema.safeParse(spec).success;
    const client = readScenarioSpec(draftFromScenario(spec)).spec !== null;
    expect(client).toBe(server);
  });
});
