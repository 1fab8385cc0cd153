import { describe, expect, test } from "vitest";
import { scenarioFaultWords } from "@/components/classroom/scenario-words";
import { DEFAULT_SCENARIO } from "@/geometry/scenario";

describe("scenarioFaultWords", () => {
  test("the default scenario: the path, its offset and its soft iron", () => {
    // |(8, −5, 12)| = √233 ≈ 15.3 µT, by hand.
    expect(scenarioFaultWords(DEFAULT_SCENARIO)).toEqual(["Full tumble, 90 s", "hard iron 15 µT", "mild soft iron"]);
  });

  test.each([
    [
      "a module against its declaration",
      {
        secondCompass: {
          mountingRotation: "x-right.z-down",
          declaredRotation: "x-forward.z-down",
          hardIronOffset: [0, 0, 0] as [number, number, number],
        },
      },
      "second compass mounted (x → right, z → down), declared (x → forward, z → down)",
    ],
    [
      "a module as declared",
      {
        secondCompass: {
          mountingRotation: "x-right.z-down",
          declaredRotation: "x-right.z-down",
          hardIronOffset: [0, 0, 0] as [number, number, number],
        },
      },
      "second compass (x → right, z → down)",
    ],
    [
      "a motor run",
      { currentCoupling: { perAmpMicrotesla: [0.3, 0, 0.4] as [number, number, number], maxAmps: 25 } },
      "motor run to 25 A, 0.5 µT/A",
    ],
    ["saturation", { clipLevelMicrotesla: 55 }, "clips at ±55 µT"],
    ["shaky holds", { holds: { faces: ["+z" as const], wobbleDeg: 6, tiltDeg: 0 } }, "1 hold, wobble 6.0°"],
    ["steel", { steel: { distanceM: 1.2 } }, "steel at 1.2 m"],
    ["a steady spin", { path: "steady-spin" as const }, "Steady spin, 90 s"],
    [
      "a magnet carried past",
      { glitchBurst: { kind: "magnet" as const, startS: 52, durationS: 1.5, fieldMultiple: 4 } },
      "magnet carried past for 1.5 s at 52 s",
    ],
    [
      "a stuck compass",
      { glitchBurst: { kind: "stuck" as const, startS: 8, durationS: 3, fieldMultiple: 4 } },
      "stuck compass for 3.0 s at 8.0 s",
    ],
    ["a noisy sensor", { noiseMicrotesla: 2.5 }, "noise 2.5 µT"],
    [
      "custom soft iron",
      {
        softIron: [
          [1, 0, 0],
          [0, 1, 0],
          [0, 0, 1],
        ] as [[number, number, number], [number, number, number], [number, number, number]],
      },
      "custom soft iron",
    ],
  ])("%s", (_label, change, words) => {
    expect(scenarioFaultWords({ ...DEFAULT_SCENARIO, ...change })).toContain(words);
  });
});
