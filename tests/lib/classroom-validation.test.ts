import { describe, expect, test } from "vitest";
import { DEFAULT_SCENARIO, type ScenarioSpec } from "@/geometry/scenario";
import { answerSchema, controlSchema, joinSchema, questionSchema, scenarioSchema, scenarioSpecSchema } from "@/lib/validations/classroom";

/** The first issue's path and message, or null when the value is valid. */
function firstIssue(
  schema: { safeParse: (v: unknown) => { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } } },
  value: unknown,
) {
  const result = schema.safeParse(value);
  if (result.success) return null;
  const issue = result.error!.issues[0];
  return { path: issue.path.join("."), message: issue.message };
}

const spec = (over: Partial<Record<keyof ScenarioSpec, unknown>>) => ({ ...DEFAULT_SCENARIO, ...over });

describe("scenarioSpecSchema", () => {
  test("the default scenario is valid", () => {
    expect(firstIssue(scenarioSpecSchema, DEFAULT_SCENARIO)).toBeNull();
  });

  test("a scenario saved before glitch bursts existed (no glitchBurst at all) is still valid", () => {
    const { glitchBurst: _, ...saved } = DEFAULT_SCENARIO;
    expect(firstIssue(scenarioSpecSchema, saved)).toBeNull();
  });

  test.each([
    [
      "a custom soft-iron matrix near the identity",
      {
        softIron: [
          [1.1, 0.05, 0],
          [0.05, 0.95, 0],
          [0, 0, 1],
        ],
      },
    ],
    [
      "a second compass declared as mounted",
      { secondCompass: { mountingRotation: "x-right.z-down", declaredRotation: "x-right.z-down", hardIronOffset: [1, 2, 3] } },
    ],
    ["six holds with wobble", { holds: { faces: ["+z", "-z", "+x", "-x", "+y", "-y"], wobbleDeg: 3, tiltDeg: 0 } }],
    ["current coupling", { currentCoupling: { perAmpMicrotesla: [0.3, 0, -0.2], maxAmps: 30 } }],
    ["a steady spin", { path: "steady-spin" }],
    ["a magnet carried past", { glitchBurst: { kind: "magnet", startS: 40, durationS: 1.5, fieldMultiple: 4 } }],
    // Limits from GLITCH_BURST_LIMITS (geometry/scenario.ts); the default capture is 90 s.
    ["the shortest, smallest burst at the very start", { glitchBurst: { kind: "stuck", startS: 0, durationS: 0.1, fieldMultiple: 1.5 } }],
    [
      "the longest, largest burst ending with the capture",
      { glitchBurst: { kind: "magnet", startS: 86, durationS: 4, fieldMultiple: 20 } },
    ],
    [
      "a burst during the holds and motor run, which lengthen the capture to 90 + 7 + 23 s",
      {
        holds: { faces: ["+z"], wobbleDeg: 0, tiltDeg: 0 },
        currentCoupling: { perAmpMicrotesla: [0.3, 0, -0.2], maxAmps: 30 },
        glitchBurst: { kind: "magnet", startS: 118, durationS: 2, fieldMultiple: 4 },
      },
    ],
  ])("valid: %s", (_label, over) => {
    expect(firstIssue(scenarioSpecSchema, spec(over))).toBeNull();
  });

  test.each([
    ["latitude out of range", { site: { ...DEFAULT_SCENARIO.site, latitudeDeg: 91 } }, "site.latitudeDeg", /Latitude/],
    ["a date that is not a date", { date: "10/01/2026" }, "date", /YYYY-MM-DD/],
    ["a date outside the model's span", { date: "1999-01-01" }, "date", /2020 and 2035/],
    ["a fractional seed", { seed: 1.5 }, "seed", /whole number/],
    ["an unknown path", { path: "loop" }, "path", /rotation path/],
    ["an unknown path: the choices include the steady spin", { path: "spin" }, "path", /steady spin/],
    [
      "an unknown burst kind",
      { glitchBurst: { kind: "spark", startS: 10, durationS: 1, fieldMultiple: 4 } },
      "glitchBurst.kind",
      /Glitch burst kind/,
    ],
    [
      "a burst before the capture",
      { glitchBurst: { kind: "magnet", startS: -1, durationS: 1, fieldMultiple: 4 } },
      "glitchBurst.startS",
      /Glitch burst start must be 0 s or later/,
    ],
    [
      "a burst too short",
      { glitchBurst: { kind: "magnet", startS: 10, durationS: 0.05, fieldMultiple: 4 } },
      "glitchBurst.durationS",
      /Glitch burst length must be between 0\.1 and 4/,
    ],
    [
      "a burst too long",
      { glitchBurst: { kind: "magnet", startS: 10, durationS: 11, fieldMultiple: 4 } },
      "glitchBurst.durationS",
      /Glitch burst length/,
    ],
    [
      "a burst too small to leave the sphere",
      { glitchBurst: { kind: "magnet", startS: 10, durationS: 1, fieldMultiple: 1.2 } },
      "glitchBurst.fieldMultiple",
      /Glitch burst size must be between 1\.5 and 20/,
    ],
    [
      "a burst running past the end of the 90 s capture",
      { glitchBurst: { kind: "magnet", startS: 89, durationS: 2, fieldMultiple: 4 } },
      "glitchBurst.startS",
      /end within the capture's 90 s/,
    ],
    ["a two-number offset", { hardIronOffset: [1, 2] }, "hardIronOffset", /three numbers/],
    ["an offset too large", { hardIronOffset: [1, 2, 900] }, "hardIronOffset.2", /between -600 and 600/],
    ["an unknown soft-iron level", { softIron: "medium" }, "softIron", /none, mild, strong/],
    [
      "a soft-iron diagonal far from 1",
      {
        softIron: [
          [0.3, 0, 0],
          [0, 1, 0],
          [0, 0, 1],
        ],
      },
      "softIron.0.0",
      /diagonal entries must be between 0\.5 and 2/,
    ],
    [
      "a flattening soft-iron matrix",
      {
        softIron: [
          [0.5, 0.5, 0],
          [0.5, 0.5, 0],
          [0, 0, 1],
        ],
      },
      "softIron",
      /flat/,
    ],
    [
      "a mounting that is none of the 48 (x and z both forward)",
      { secondCompass: { mountingRotation: "x-forward.z-forward", declaredRotation: "x-forward.z-down", hardIronOffset: [0, 0, 0] } },
      "secondCompass.mountingRotation",
      /Second compass mounting: choose one of the 48 mountings, e\.g\. x-right\.z-down/,
    ],
    ["a face held twice", { holds: { faces: ["+z", "+z"], wobbleDeg: 0, tiltDeg: 0 } }, "holds.faces", /once/],
    ["no current", { currentCoupling: { perAmpMicrotesla: [0, 0, 0], maxAmps: 0 } }, "currentCoupling.maxAmps", /Maximum current/],
    ["too long a capture", { sampleRateHz: 200, pathSeconds: 600 }, "sampleRateHz", /60,000 samples/],
  ])("refused: %s", (_label, over, path, message) => {
    const issue = firstIssue(scenarioSpecSchema, spec(over));
    expect(issue?.path).toBe(path);
    expect(issue?.message).toMatch(message);
  });
});

describe("scenarioSchema", () => {
  test("a name is needed; description and answer default to empty", () => {
    expect(firstIssue(scenarioSchema, { name: " ", spec: DEFAULT_SCENARIO })).toEqual({
      path: "name",
      message: "Give the scenario a name.",
    });
    expect(scenarioSchema.parse({ name: "Steel", spec: DEFAULT_SCENARIO })).toMatchObject({ description: "", answer: "" });
  });
});

describe("controlSchema", () => {
  test.each([
    ["play", { action: "play" }, null],
    ["step with the default length", { action: "step" }, null],
    ["speed without a speed", { action: "speed" }, "speed"],
    ["too fast", { action: "speed", speed: 16 }, "speed"],
    ["an unknown action", { action: "rewind" }, "action"],
  ])("%s", (_label, body, path) => {
    expect(firstIssue(controlSchema, body)?.path ?? null).toBe(path);
  });

  test("step defaults to 5 s of capture", () => {
    expect(controlSchema.parse({ action: "step" }).stepSeconds).toBe(5);
  });
});

describe("questionSchema, answerSchema, joinSchema", () => {
  test.each([
    ["a question with two choices", questionSchema, { prompt: "Pass or fail?", choices: ["Pass", "Fail"] }, null],
    ["one choice", questionSchema, { prompt: "?", choices: ["Pass"] }, "choices"],
    ["seven choices", questionSchema, { prompt: "?", choices: ["a", "b", "c", "d", "e", "f", "g"] }, "choices"],
    ["the same choice twice", questionSchema, { prompt: "?", choices: ["Pass", "pass"] }, "choices"],
    ["an answer", answerSchema, { questionId: "3b241101-e2bb-4255-8caf-4136c566a962", choice: 1 }, null],
    ["a negative choice", answerSchema, { questionId: "3b241101-e2bb-4255-8caf-4136c566a962", choice: -1 }, "choice"],
    ["a join with a name", joinSchema, { code: "K7MX3D", displayName: "Sam" }, null],
    ["a join without a code", joinSchema, { code: "" }, "code"],
    ["a long display name", joinSchema, { code: "K7MX3D", displayName: "x".repeat(41) }, "displayName"],
  ])("%s", (_label, schema, body, path) => {
    expect(firstIssue(schema as never, body)?.path ?? null).toBe(path);
  });
});
