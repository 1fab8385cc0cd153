import { z } from "zod";
import { MOUNTING_IDS } from "@/geometry/mounting-rotations";
import { GLITCH_BURST_LIMITS, type ScenarioSpec } from "@/geometry/scenario";
import { DEFAULT_STEP_SECONDS, SPEED_RANGE } from "@/lib/classroom/playback-clock";

/**
 * Teaching scenarios, class sessions, questions, answers and joining. Every message names
 * its field in words, so the scenario builder can place it beside the input.
 */

const number = (label: string, min: number, max: number) =>
  z
    .number({ error: `${label} must be a number.` })
    .refine((v) => Number.isFinite(v), `${label} must be a number.`)
    .refine((v) => v >= min && v <= max, `${label} must be between ${min} and ${max}.`);

const vec3 = (label: string, limit: number) =>
  z.tuple([number(`${label} x`, -limit, limit), number(`${label} y`, -limit, limit), number(`${label} z`, -limit, limit)], {
    error: `${label} needs three numbers (x, y, z).`,
  });

const mountingId = (label: string) => z.enum(MOUNTING_IDS, { error: `${label}: choose one of the 48 mountings, e.g. x-right.z-down.` });

const BODY_FACES = ["+x", "-x", "+y", "-y", "+z", "-z"] as const;
export const ROTATION_PATHS = ["full", "yaw-only", "upper-half", "partial", "steady-spin"] as const;
export const GLITCH_BURST_KINDS = ["magnet", "stuck"] as const;
export const SOFT_IRON_CHOICES = ["none", "mild", "strong"] as const;

function det3(m: number[][]): number {
  return (
    m[0][0] * (m[1][1] * m[2][2] - m[1][2] * m[2][1]) -
    m[0][1] * (m[1][0] * m[2][2] - m[1][2] * m[2][0]) +
    m[0][2] * (m[1][0] * m[2][1] - m[1][1] * m[2][0])
  );
}

/** A custom soft-iron matrix: near the identity, as real distortions are, and never flattening the sphere. */
const softIronMatrix = z
  .tuple([vec3("Soft-iron row 1", 2), vec3("Soft-iron row 2", 2), vec3("Soft-iron row 3", 2)], {
    error: "The soft-iron matrix needs three rows of three numbers.",
  })
  .superRefine((m, context) => {
    for (let i = 0; i < 3; i++)
      for (let j = 0; j < 3; j++) {
        const v = m[i][j];
        if (i === j && (v < 0.5 || v > 2))
          context.addIssue({ code: "custom", path: [i, j], message: `Soft iron: diagonal entries must be between 0.5 and 2.` });
        if (i !== j && Math.abs(v) > 0.5)
          context.addIssue({ code: "custom", path: [i, j], message: `Soft iron: entries off the diagonal must be between −0.5 and 0.5.` });
      }
    if (det3(m) < 0.25) context.addIssue({ code: "custom", message: "Soft iron: this matrix squashes the sphere almost flat." });
  });

/** Longest capture a scenario may simulate, in samples (keeps every snapshot quick to compute). */
export const MAX_SCENARIO_SAMPLES = 60_000;

/** Seconds a scenario's capture lasts: holds (about 7 s each with the move), the path, and the motor run. */
export function scenarioSeconds(spec: Pick<ScenarioSpec, "pathSeconds" | "holds" | "currentCoupling">): number {
  return spec.pathSeconds + (spec.holds ? spec.holds.faces.length * 7 : 0) + (spec.currentCoupling ? 23 : 0);
}

export const scenarioSpecSchema = z
  .object({
    site: z.object({
      name: z.string().trim().min(1, "Give the site a name.").max(120, "Site name: use at most 120 characters."),
      latitudeDeg: number("Latitude", -90, 90),
      longitudeDeg: number("Longitude", -180, 180),
      altitudeM: number("Altitude", -500, 9000),
    }),
    date: z.iso
      .date({ error: "Give the date as YYYY-MM-DD." })
      .refine((d) => d >= "2020-01-01" && d <= "2035-12-31", "Choose a date between 2020 and 2035 (the World Magnetic Model's span)."),
    seed: z.number({ error: "Seed must be a whole number." }).int("Seed must be a whole number.").min(0).max(2_147_483_647),
    sampleRateHz: number("Sample rate", 5, 200),
    path: z.enum(ROTATION_PATHS, { error: "Choose a rotation path: full, yaw only, upper half, partial or steady spin." }),
    pathSeconds: number("Rotation length", 10, 600),
    noiseMicrotesla: number("Noise", 0, 5),
    hardIronOffset: vec3("Hard-iron offset", 600),
    softIron: z.union([z.enum(SOFT_IRON_CHOICES), softIronMatrix], { error: "Choose none, mild, strong or a 3×3 soft-iron matrix." }),
    secondCompass: z
      .object({
        mountingRotation: mountingId("Second compass mounting"),
        declaredRotation: mountingId("Second compass declaration"),
        hardIronOffset: vec3("Second compass hard-iron offset", 600),
      })
      .nullable(),
    currentCoupling: z
      .object({
        perAmpMicrotesla: vec3("Current coupling", 5),
        maxAmps: number("Maximum current", 1, 200),
      })
      .nullable(),
    clipLevelMicrotesla: number("Clip level", 10, 5000).nullable(),
    holds: z
      .object({
        faces: z
          .array(z.enum(BODY_FACES, { error: "Faces are +x, -x, +y, -y, +z or -z." }))
          .min(1, "Choose at least one face to hold.")
          .max(6)
          .refine((faces) => new Set(faces).size === faces.length, "Hold each face once."),
        wobbleDeg: number("Wobble", 0, 20),
        tiltDeg: number("Tilt", 0, 30),
      })
      .nullable(),
    steel: z.object({ distanceM: number("Distance to steel", 0.2, 20) }).nullable(),
    glitchBurst: z
      .object({
        kind: z.enum(GLITCH_BURST_KINDS, { error: "Glitch burst kind: choose a magnet carried past (magnet) or a stuck reading (stuck)." }),
        startS: z
          .number({ error: "Glitch burst start must be a number." })
          .refine((v) => Number.isFinite(v), "Glitch burst start must be a number.")
          .refine((v) => v >= 0, "Glitch burst start must be 0 s or later."),
        durationS: number("Glitch burst length", GLITCH_BURST_LIMITS.durationS.min, GLITCH_BURST_LIMITS.durationS.max),
        fieldMultiple: number("Glitch burst size", GLITCH_BURST_LIMITS.fieldMultiple.min, GLITCH_BURST_LIMITS.fieldMultiple.max),
      })
      // Absent in scenarios saved before glitch bursts existed.
      .nullish(),
  })
  .refine((spec) => scenarioSeconds(spec) * spec.sampleRateHz <= MAX_SCENARIO_SAMPLES, {
    path: ["sampleRateHz"],
    message: `The capture would be longer than ${MAX_SCENARIO_SAMPLES.toLocaleString("en-GB")} samples: lower the sample rate or shorten the rotation.`,
  })
  .superRefine((spec, context) => {
    const burst = spec.glitchBurst;
    const seconds = scenarioSeconds(spec);
    if (burst && burst.startS + burst.durationS > seconds)
      context.addIssue({
        code: "custom",
        path: ["glitchBurst", "startS"],
        message: `Glitch burst start: the burst must end within the capture's ${seconds} s, so start it earlier or make it shorter.`,
      });
  }) satisfies z.ZodType<ScenarioSpec>;

const scenarioFields = {
  name: z.string().trim().min(1, "Give the scenario a name.").max(120, "Name: use at most 120 characters."),
  description: z.string().trim().max(2000, "Description: use at most 2000 characters.").default(""),
  spec: scenarioSpecSchema,
  answer: z.string().trim().max(2000, "Answer: use at most 2000 characters.").default(""),
};

export const scenarioSchema = z.object(scenarioFields);
export type ScenarioInput = z.infer<typeof scenarioSchema>;

/** A PATCH may send any of the fields; those it leaves out keep their value. */
export const scenarioUpdateSchema = z.object({
  name: scenarioFields.name.optional(),
  description: z.string().trim().max(2000, "Description: use at most 2000 characters.").optional(),
  spec: scenarioSpecSchema.optional(),
  answer: z.string().trim().max(2000, "Answer: use at most 2000 characters.").optional(),
});
export type ScenarioUpdate = z.infer<typeof scenarioUpdateSchema>;

const speed = number("Speed", SPEED_RANGE.min, SPEED_RANGE.max);

export const createSessionSchema = z.object({
  scenarioId: z.uuid({ error: "Choose a scenario." }),
  allowGuests: z.boolean({ error: "allowGuests is true or false." }).default(false),
  speed: speed.default(1),
});

export const CONTROL_ACTIONS = ["play", "pause", "step", "restart", "speed", "freeze", "unfreeze", "reveal", "hide", "end"] as const;
export type ControlAction = (typeof CONTROL_ACTIONS)[number];

export const controlSchema = z
  .object({
    action: z.enum(CONTROL_ACTIONS, { error: `Choose an action: ${CONTROL_ACTIONS.join(", ")}.` }),
    speed: speed.optional(),
    stepSeconds: number("Step", 0.04, 600).default(DEFAULT_STEP_SECONDS),
  })
  .refine((c) => c.action !== "speed" || c.speed !== undefined, { path: ["speed"], message: "Give the new speed." });
export type ControlInput = z.infer<typeof controlSchema>;

export const questionSchema = z.object({
  prompt: z.string().trim().min(1, "Write the question.").max(300, "Question: use at most 300 characters."),
  choices: z
    .array(z.string().trim().min(1, "A choice cannot be empty.").max(120, "A choice: use at most 120 characters."), {
      error: "Give between 2 and 6 choices.",
    })
    .min(2, "Give at least 2 choices.")
    .max(6, "Give at most 6 choices.")
    .refine((choices) => new Set(choices.map((c) => c.toLowerCase())).size === choices.length, "Each choice must differ from the others."),
});

export const answerSchema = z.object({
  questionId: z.uuid({ error: "That question is not valid." }),
  choice: z.number({ error: "Choose one of the answers." }).int("Choose one of the answers.").min(0, "Choose one of the answers."),
});

export const joinSchema = z.object({
  code: z.string({ error: "Enter the code shown by your instructor." }).trim().min(1, "Enter the code shown by your instructor.").max(20),
  displayName: z.string().trim().max(40, "Display name: use at most 40 characters.").optional(),
});
