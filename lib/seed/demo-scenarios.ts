import { DEFAULT_SCENARIO, type ScenarioSpec } from "@/geometry/scenario";
import type { VerdictStatus } from "@/geometry/verdict";
import { createScenario } from "@/lib/data/scenarios";
import { db } from "@/lib/db";
import { DEMO_PEOPLE, DEMO_WORKSPACES } from "@/lib/seed/demo-people";

/**
 * Ready-made teaching scenarios for the demo workspaces, each teaching one fault (the first
 * teaches what a good calibration looks like). Sites are our own invention at coordinates of
 * our choosing, so the World Magnetic Model gives them real field values. `lesson` is what the
 * class should see at the end of the capture; tests/lib/classroom-demo-scenarios.test.ts holds
 * every scenario to it.
 */
export interface DemoScenario {
  name: string;
  description: string;
  answer: string;
  spec: ScenarioSpec;
  lesson: { verdict: VerdictStatus; checks: string[] };
}

const SITE = { name: "Brackenfold top field", latitudeDeg: 55.83, longitudeDeg: -3.42, altitudeM: 240 };
const BASE: ScenarioSpec = { ...DEFAULT_SCENARIO, site: SITE, date: "2026-11-10", seed: 3, pathSeconds: 90 };
const SIX_FACES: ScenarioSpec["holds"] = { faces: ["+z", "-z", "+x", "-x", "+y", "-y"], wobbleDeg: 0, tiltDeg: 0 };

export const DEMO_SCENARIOS: DemoScenario[] = [
  {
    name: "A sound calibration",
    description: "A full tumble in open ground: every orientation, upside down included. Use it first, to show what good looks like.",
    answer:
      "Nothing is wrong. The readings cover the whole sphere, the fitted offset and soft-iron matrix are modest, and the corrected field strength and inclination match the World Magnetic Model for the site.",
    spec: BASE,
    lesson: { verdict: "pass", checks: [] },
  },
  {
    name: "Never turned over",
    description: "The vehicle is turned round and tipped, but never past its side: the lower half of the sphere stays empty.",
    answer:
      "Incomplete rotation: the vehicle was never turned upside down, so a whole half of the sphere has no readings and the fit cannot pin the offset along the vertical. Turn it through every orientation, upside down included.",
    spec: { ...BASE, path: "upper-half" },
    lesson: { verdict: "fail", checks: ["mag.gap"] },
  },
  {
    name: "A flat spin",
    description: "The vehicle is only spun level on the ground, about its vertical axis.",
    answer:
      "Rotation about one axis only: the readings trace a single ring instead of covering the sphere, so neither the offset nor the soft iron can be solved. Tumble the vehicle through every orientation.",
    spec: { ...BASE, path: "yaw-only" },
    lesson: { verdict: "fail", checks: ["mag.coverage", "mag.fit"] },
  },
  {
    name: "Mast module turned on its mount",
    description: "Two compasses: the board's and an external module on the mast. Compare them as the capture plays.",
    answer:
      "The mast module is mounted a quarter turn clockwise seen from above (module x → vehicle right, module z → down), but declared aligned with the vehicle (module x → vehicle forward, module z → down). The two compasses disagree by a right angle — the classic cause of a vehicle that circles and drifts away. Declare the true mounting, or turn the module back.",
    spec: {
      ...BASE,
      secondCompass: { mountingRotation: "x-right.z-down", declaredRotation: "x-forward.z-down", hardIronOffset: [-3, 4, 2] },
    },
    lesson: { verdict: "fail", checks: ["mag.mounting"] },
  },
  {
    name: "Beside a steel container",
    description: "The calibration is done in a yard, a little over half a metre from a steel container.",
    answer:
      "Steel nearby: the container bends the Earth's field differently wherever the vehicle is held, which the fit mistakes for soft iron on the vehicle, and the field strength no longer matches the World Magnetic Model. Calibrate in open ground, away from steel, vehicles and reinforced concrete.",
    spec: { ...BASE, steel: { distanceM: 0.6 } },
    lesson: { verdict: "fail", checks: ["mag.soft-iron", "mag.field-vs-model"] },
  },
  {
    name: "Power wiring beside the compass",
    description:
      "After the tumble, a motor run logs the field with the motor current (simulated: propellers off, vehicle restrained, battery handled per its maker, people clear).",
    answer:
      "Current coupling: the field the compass reads moves with the motor current, because power wiring runs close to it. Move the compass (a mast) or the wiring, or twist the supply pair. Real motor tests are made with propellers off, the vehicle restrained, the battery handled per its maker and people clear, under local rules (aviation rules where the vehicle flies), the maker's manual and licensed practice.",
    spec: { ...BASE, currentCoupling: { perAmpMicrotesla: [0.35, 0.1, -0.3], maxAmps: 35 } },
    lesson: { verdict: "fail", checks: ["mag.current"] },
  },
  {
    name: "A saturated compass",
    description: "A compass with a large offset and a small measuring range.",
    answer:
      "Saturation: the offset pushes the readings past the sensor's range, so they are clipped flat at its limit and the fit is bent by the clipped points. Find and remove the magnetised part, or use a sensor with a wider range.",
    spec: { ...BASE, hardIronOffset: [60, -20, 35], clipLevelMicrotesla: 80 },
    lesson: { verdict: "fail", checks: ["mag.samples-clipped"] },
  },
  {
    name: "A magnetised part",
    description:
      "A good tumble, but something on the vehicle near the compass is strongly magnetised. The compass measures up to ±400 µT on each axis.",
    answer:
      "A very large hard-iron offset: a magnetised part (a screw, a tool, a speaker magnet) sits close to the compass. The fit can subtract it, but with the Earth's field added the readings reach within an eighth of the compass's ±400 µT range, and the offset changes if the part moves: a little more and the readings clip. Find the part and demagnetise or move it.",
    spec: { ...BASE, hardIronOffset: [300, -120, 90], clipLevelMicrotesla: 400 },
    lesson: { verdict: "fail", checks: ["mag.hard-iron"] },
  },
  {
    name: "Crooked accelerometer holds",
    description: "The six accelerometer holds come first, then the tumble. Watch the holds.",
    answer:
      "Each accelerometer hold is tilted about 30° from the face it should rest on. The offsets and scales can still be fitted, but holds this crooked leave them noticeably less certain than square holds would, and the level hold is so far from level that the level trim it gives is wrong. Rest the vehicle squarely on each face, using a box or a jig.",
    spec: { ...BASE, holds: { ...SIX_FACES!, tiltDeg: 30 } },
    lesson: { verdict: "fail", checks: ["accel.tilt", "accel.trim"] },
  },
  {
    name: "A phone carried past",
    description:
      "A good tumble, but partway through someone walks up with a phone in hand and holds it near the vehicle for a moment. Watch the compass readings.",
    answer:
      "A passing disturbance: for about a second and a half the phone was close enough to the compass to push its readings far off the sphere. The fit leaves that stretch out, so the offset and soft iron are as sound as without it, and the check on stretches left out warns, saying when the stretch began and how long it lasted. Its cause could as well have been a loose compass connector, which would not stay on the ground: find what was near the compass at that moment, keep phones, tools and magnets away while the vehicle is turned, and repeat the capture.",
    spec: { ...BASE, glitchBurst: { kind: "magnet", startS: 52, durationS: 1.5, fieldMultiple: 4 } },
    lesson: { verdict: "warn", checks: ["mag.left-out"] },
  },
  {
    name: "Turned steadily on the ground",
    description:
      "Six accelerometer holds, then the vehicle is turned slowly and steadily round on level ground, with the compass, accelerometer and gyroscope all logged. Watch the gyroscope bias.",
    answer:
      "Two lessons. A steady turn on the ground is not a compass calibration: the readings trace one ring, so most of the sphere stays empty; tumble the vehicle through every orientation instead. And a steady turn is not a still period: the accelerometer reads the same all through it, because gravity does not move, but the compass heading turns, so the gyroscope's steady reading there is the turn and not a bias. The bias is taken from the six holds alone, where it is tiny. Measure gyroscope bias only with the vehicle left untouched for a few seconds.",
    spec: { ...BASE, path: "steady-spin", holds: SIX_FACES },
    lesson: { verdict: "fail", checks: ["mag.coverage", "mag.gap"] },
  },
];

/**
 * Add to each demo workspace the ready-made scenarios it lacks by name, made by its first
 * instructor (else its owner), so a workspace seeded before a scenario was added gets it on
 * the next seed. Idempotent: a scenario of the same name (ready-made or a user's) is left alone.
 */
export async function seedDemoScenarios(log: (line: string) => void = () => {}): Promise<void> {
  const { models } = db();
  for (const demo of DEMO_WORKSPACES) {
    const workspace = await models.Workspace.findOne({ where: { slug: demo.slug } });
    if (!workspace) continue;
    const teacher =
      DEMO_PEOPLE.find((p) => p.memberships.some((m) => m.workspace === demo.slug && m.role === "instructor")) ??
      DEMO_PEOPLE.find((p) => p.memberships.some((m) => m.workspace === demo.slug && m.role === "owner"));
    const author = teacher ? await models.User.findOne({ where: { email: teacher.email } }) : null;
    let made = 0;
    for (const scenario of DEMO_SCENARIOS) {
      if (await models.Scenario.findOne({ where: { workspaceId: workspace.id, name: scenario.name } })) continue;
      const { name, description, answer, spec } = scenario;
      await createScenario(workspace.id, author?.id ?? null, { name, description, answer, spec }, { readyMade: true });
      made += 1;
    }
    log(`${made} ready-made teaching scenarios in ${demo.slug}`);
  }
}
