/**
 * Every route handler and every server action, called as each role of a workspace, as a
 * member of another workspace only, and anonymously. Permitted calls must work; the rest
 * must answer 401 / 403 / 404 (or the matching action error code) and reveal no data.
 * The expected matrix is written out here, independently of lib/permissions.ts, and it
 * matches the README's "Roles" table. A completeness check fails when a new route or action
 * is added without a row here.
 */
import fs from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { stopQueue } from "@/lib/jobs/queue";
import { DEFAULT_SCENARIO } from "@/geometry/scenario";
import { idle, type ActionState } from "@/lib/action-state";
import { closeDb, db } from "@/lib/db";
import { inviteMember } from "@/lib/data/invitations";
import type { UserSummary } from "@/lib/data/users";
import type { WorkspaceSummary } from "@/lib/data/workspaces";
import type { Role } from "@/lib/roles";
import { actAs } from "../support/request-context";
import { addMember, form, makeUser, makeWorkspace, uniqueTag } from "../support/factories";

type Actor = Role | "outsider" | "anonymous";
const ACTORS: Actor[] = ["owner", "technician", "builder", "instructor", "student", "outsider", "anonymous"];
const ALL_ROLES: Role[] = ["owner", "technician", "builder", "instructor", "student"];

let workspace: WorkspaceSummary;
const users = {} as Record<Exclude<Actor, "anonymous">, UserSummary>;

beforeAll(async () => {
  users.owner = await makeUser("owner");
  workspace = await makeWorkspace(users.owner, "perm");
  for (const role of ["technician", "builder", "instructor", "student"] as const) {
    users[role] = await makeUser(role);
    await addMember(workspace, users[role], role);
  }
  // The outsider owns a workspace of their own: being signed in and powerful elsewhere must not help.
  users.outsider = await makeUser("outsider");
  await makeWorkspace(users.outsider, "other");
});

afterAll(async () => {
  await stopQueue();
  await closeDb();
});

function actAsActor(actor: Actor) {
  actAs(actor === "anonymous" ? null : users[actor].id);
}

async function route(file: string, method: string) {
  const mod = (await import(/* @vite-ignore */ path.resolve(file))) as Record<string, (req: Request, ctx: unknown) => Promise<Response>>;
  return mod[method];
}

async function action(name: string) {
  const mod = (await import(/* @vite-ignore */ path.resolve(`lib/actions/${name}.ts`))) as Record<
    string,
    (s: ActionState, f: FormData) => Promise<ActionState>
  >;
  return Object.values(mod)[0];
}

/** Expected status per actor: ok statuses for permitted roles, 401/403/404 for the rest. */
type Expect = Record<Actor, number>;
const expectFor = (ok: number, allowed: Role[], overrides: Partial<Expect> = {}): Expect => ({
  owner: allowed.includes("owner") ? ok : 403,
  technician: allowed.includes("technician") ? ok : 403,
  builder: allowed.includes("builder") ? ok : 403,
  instructor: allowed.includes("instructor") ? ok : 403,
  student: allowed.includes("student") ? ok : 403,
  outsider: 404,
  anonymous: 401,
  ...overrides,
});

interface WorkspaceRouteCase {
  file: string;
  method: "GET" | "POST" | "PATCH" | "DELETE";
  expect: Expect;
  /** Path parameters besides the slug (resources made fresh for each call when needed). */
  params?: () => Promise<Record<string, string>>;
  body?: () => Record<string, unknown>;
  /** A key the permitted answer must carry. */
  dataKey?: string;
  query?: string;
}

const EDITORS: Role[] = ["owner", "technician", "builder"];
const VIEWERS: Role[] = ["owner", "technician", "builder", "instructor"];
const TEACHERS: Role[] = ["owner", "instructor"];
// Resources made by the owner: a builder may see them but not edit them ("own only").
const fixtures = {} as { vehicleId: string; sensorId: string; siteId: string; runId: string; processedRunId: string; scenarioId: string };
const runParams = async () => ({ runId: fixtures.processedRunId });
/** A scenario made by the owner, fresh for each call (one call deletes it). */
const scenarioParams = async () => {
  const { createScenario } = await import("@/lib/data/scenarios");
  const scenario = await createScenario(workspace.id, users.owner.id, {
    name: `Fixture ${uniqueTag()}`,
    description: "",
    spec: DEFAULT_SCENARIO,
    answer: "",
  });
  return { scenarioId: scenario.id };
};

const WORKSPACE_ROUTES: WorkspaceRouteCase[] = [
  { file: "app/api/workspaces/[slug]/route.ts", method: "GET", expect: expectFor(200, ALL_ROLES), dataKey: "workspace" },
  { file: "app/api/workspaces/[slug]/members/route.ts", method: "GET", expect: expectFor(200, VIEWERS), dataKey: "members" },
  { file: "app/api/workspaces/[slug]/invitations/route.ts", method: "GET", expect: expectFor(200, ["owner"]), dataKey: "invitations" },
  {
    file: "app/api/workspaces/[slug]/invitations/route.ts",
    method: "POST",
    expect: expectFor(201, ["owner"]),
    body: () => ({ email: `invitee-${uniqueTag()}@tests.example`, role: "builder" }),
    dataKey: "invitation",
  },
  { file: "app/api/workspaces/[slug]/audit/route.ts", method: "GET", expect: expectFor(200, ["owner", "technician"]), dataKey: "events" },
  { file: "app/api/workspaces/[slug]/sites/route.ts", method: "GET", expect: expectFor(200, ALL_ROLES), dataKey: "sites" },
  {
    file: "app/api/workspaces/[slug]/sites/route.ts",
    method: "POST",
    expect: expectFor(201, EDITORS),
    body: () => ({ name: `Site ${uniqueTag()}`, latitudeDeg: 10, longitudeDeg: 20, altitudeM: 5 }),
    dataKey: "site",
  },
  {
    file: "app/api/workspaces/[slug]/sites/[siteId]/route.ts",
    method: "PATCH",
    expect: expectFor(200, EDITORS),
    params: async () => ({ siteId: fixtures.siteId }),
    body: () => ({ name: `Renamed site ${uniqueTag()}`, latitudeDeg: 11, longitudeDeg: 21, altitudeM: 6 }),
    dataKey: "site",
  },
  { file: "app/api/workspaces/[slug]/vehicles/route.ts", method: "GET", expect: expectFor(200, VIEWERS), dataKey: "items" },
  {
    file: "app/api/workspaces/[slug]/vehicles/route.ts",
    method: "POST",
    expect: expectFor(201, EDITORS),
    body: () => ({ name: `Vehicle ${uniqueTag()}`, kind: "rover" }),
    dataKey: "vehicle",
  },
  {
    file: "app/api/workspaces/[slug]/vehicles/[vehicleId]/route.ts",
    method: "GET",
    expect: expectFor(200, VIEWERS),
    params: async () => ({ vehicleId: fixtures.vehicleId }),
    dataKey: "sensors",
  },
  {
    file: "app/api/workspaces/[slug]/vehicles/[vehicleId]/route.ts",
    method: "PATCH",
    expect: expectFor(200, ["owner", "technician"]),
    params: async () => ({ vehicleId: fixtures.vehicleId }),
    body: () => ({ name: `Kittiwake ${uniqueTag()}`, kind: "multirotor" }),
    dataKey: "vehicle",
  },
  {
    file: "app/api/workspaces/[slug]/vehicles/[vehicleId]/sensors/route.ts",
    method: "GET",
    expect: expectFor(200, VIEWERS),
    params: async () => ({ vehicleId: fixtures.vehicleId }),
    dataKey: "sensors",
  },
  {
    file: "app/api/workspaces/[slug]/vehicles/[vehicleId]/sensors/route.ts",
    method: "POST",
    expect: expectFor(201, ["owner", "technician"]),
    params: async () => ({ vehicleId: fixtures.vehicleId }),
    body: () => ({
      kind: "accelerometer",
      label: `imu ${uniqueTag()}`,
      placement: "internal",
      mountingRotation: "x-forward.z-down",
      units: "m/s2",
    }),
    dataKey: "sensor",
  },
  {
    file: "app/api/workspaces/[slug]/sensors/[sensorId]/route.ts",
    method: "PATCH",
    expect: expectFor(200, ["owner", "technician"]),
    params: async () => ({ sensorId: fixtures.sensorId }),
    body: () => ({ kind: "magnetometer", label: "mast", placement: "external", mountingRotation: "x-right.z-down", units: "uT" }),
    dataKey: "sensor",
  },
  // Students list runs too, but only those shared with students (none here): 200 with no items.
  { file: "app/api/workspaces/[slug]/runs/route.ts", method: "GET", expect: expectFor(200, ALL_ROLES), dataKey: "items" },
  {
    file: "app/api/workspaces/[slug]/runs/route.ts",
    method: "POST",
    expect: expectFor(201, EDITORS),
    body: () => ({ vehicleId: fixtures.vehicleId, capturedOn: "2026-05-01", fileName: "p.csv", fileSize: 100 }),
    dataKey: "upload",
  },
  // A run not shared with students does not exist for them: 404, like for an outsider. Changing
  // a run needs a role that may change runs at all, checked first: 403 without looking the run up.
  {
    file: "app/api/workspaces/[slug]/runs/[runId]/route.ts",
    method: "GET",
    expect: expectFor(200, VIEWERS, { student: 404 }),
    params: runParams,
    dataKey: "run",
  },
  {
    file: "app/api/workspaces/[slug]/runs/[runId]/route.ts",
    method: "DELETE",
    expect: expectFor(200, ["owner", "technician"]),
    params: async () => ({ runId: await freshRun() }),
    dataKey: "deleted",
  },
  // Permitted callers reach the storage check, which answers 409: the file never arrived.
  {
    file: "app/api/workspaces/[slug]/runs/[runId]/uploaded/route.ts",
    method: "POST",
    expect: expectFor(409, ["owner", "technician"]),
    params: async () => ({ runId: await freshRun() }),
  },
  {
    file: "app/api/workspaces/[slug]/runs/[runId]/status/route.ts",
    method: "GET",
    expect: expectFor(200, VIEWERS, { student: 404 }),
    params: runParams,
    dataKey: "status",
  },
  {
    file: "app/api/workspaces/[slug]/runs/[runId]/results/route.ts",
    method: "GET",
    expect: expectFor(200, VIEWERS, { student: 404 }),
    params: runParams,
    dataKey: "results",
  },
  {
    file: "app/api/workspaces/[slug]/runs/[runId]/versions/route.ts",
    method: "GET",
    expect: expectFor(200, VIEWERS, { student: 404 }),
    params: runParams,
    dataKey: "versions",
  },
  {
    file: "app/api/workspaces/[slug]/runs/[runId]/samples/route.ts",
    method: "GET",
    expect: expectFor(200, VIEWERS, { student: 404 }),
    params: runParams,
    dataKey: "url",
  },
  {
    file: "app/api/workspaces/[slug]/runs/[runId]/file/route.ts",
    method: "GET",
    expect: expectFor(302, VIEWERS, { student: 404 }),
    params: runParams,
  },
  {
    file: "app/api/workspaces/[slug]/runs/[runId]/export/route.ts",
    method: "GET",
    expect: expectFor(200, VIEWERS, { student: 404 }),
    params: runParams,
    query: "?format=correction-json",
    dataKey: "magnetometers",
  },
  // Teaching scenarios and class sessions: scenarios for those who teach; sessions listed for those who watch.
  { file: "app/api/workspaces/[slug]/scenarios/route.ts", method: "GET", expect: expectFor(200, TEACHERS), dataKey: "scenarios" },
  {
    file: "app/api/workspaces/[slug]/scenarios/route.ts",
    method: "POST",
    expect: expectFor(201, TEACHERS),
    body: () => ({ name: `Scenario ${uniqueTag()}`, spec: DEFAULT_SCENARIO, answer: "Nothing is wrong." }),
    dataKey: "scenario",
  },
  {
    file: "app/api/workspaces/[slug]/scenarios/[scenarioId]/route.ts",
    method: "GET",
    expect: expectFor(200, TEACHERS),
    params: scenarioParams,
    dataKey: "scenario",
  },
  {
    file: "app/api/workspaces/[slug]/scenarios/[scenarioId]/route.ts",
    method: "PATCH",
    expect: expectFor(200, TEACHERS),
    params: scenarioParams,
    body: () => ({ answer: "Steel nearby." }),
    dataKey: "scenario",
  },
  {
    file: "app/api/workspaces/[slug]/scenarios/[scenarioId]/route.ts",
    method: "DELETE",
    expect: expectFor(200, TEACHERS),
    params: scenarioParams,
    dataKey: "deleted",
  },
  {
    file: "app/api/workspaces/[slug]/scenarios/[scenarioId]/duplicate/route.ts",
    method: "POST",
    expect: expectFor(201, TEACHERS),
    params: scenarioParams,
    dataKey: "scenario",
  },
  {
    file: "app/api/workspaces/[slug]/class-sessions/route.ts",
    method: "GET",
    expect: expectFor(200, ["owner", "technician", "instructor", "student"]),
    dataKey: "sessions",
  },
  {
    file: "app/api/workspaces/[slug]/class-sessions/route.ts",
    method: "POST",
    expect: expectFor(201, TEACHERS),
    body: () => ({ scenarioId: fixtures.scenarioId, allowGuests: false }),
    dataKey: "session",
  },
  // Last: re-processing makes the run's current version a queued one.
  {
    file: "app/api/workspaces/[slug]/runs/[runId]/versions/route.ts",
    method: "POST",
    expect: expectFor(202, ["owner", "technician"]),
    params: runParams,
    body: () => ({ model: "axis" }),
    dataKey: "version",
  },
];

/** A run registered by the owner (no file uploaded). */
async function freshRun(): Promise<string> {
  const { createRun } = await import("@/lib/data/runs");
  const { run } = await createRun(workspace.id, users.owner.id, {
    vehicleId: fixtures.vehicleId,
    capturedOn: "2026-05-02",
    title: "",
    fileName: "f.csv",
    fileSize: 10,
    columnMapping: {},
    units: {},
    sensorSlots: {},
    model: "auto",
    powersMotors: false,
  });
  return run.id;
}

beforeAll(async () => {
  const { createVehicle } = await import("@/lib/data/vehicles");
  const { createSensor } = await import("@/lib/data/sensors");
  const { createSite } = await import("@/lib/data/sites");
  const { processRunVersion } = await import("@/lib/jobs/process-run-version");
  const vehicle = await createVehicle(workspace.id, users.owner.id, {
    name: "Fulmar",
    kind: "multirotor",
    airframe: "",
    serialTag: "",
    customer: "",
    notes: "",
  });
  fixtures.vehicleId = vehicle.id;
  fixtures.sensorId = (
    await createSensor(workspace.id, users.owner.id, vehicle.id, {
      kind: "magnetometer",
      label: "board",
      placement: "internal",
      mountingRotation: "x-forward.z-down",
      units: "uT",
      columnHints: [],
    })
  ).id;
  fixtures.siteId = (
    await createSite(workspace.id, users.owner.id, {
      name: "Permissions field",
      latitudeDeg: 47,
      longitudeDeg: 8,
      altitudeM: 400,
      notes: "",
    })
  ).id;
  actAs(users.owner.id);
  const { uploadRun, simulatedCsv } = await import("../support/runs");
  const uploaded = await uploadRun(workspace, { vehicleId: vehicle.id, csv: simulatedCsv({ seed: 5, pathSeconds: 30 }) });
  fixtures.processedRunId = uploaded.runId;
  const run = await db().models.Run.findByPk(uploaded.runId);
  await processRunVersion(run!.currentVersionId!);
  fixtures.scenarioId = (await scenarioParams()).scenarioId;
});

describe.each(WORKSPACE_ROUTES)("$method $file", (c) => {
  test.each(ACTORS)("as %s", async (actor) => {
    const extra = c.params ? await c.params() : {};
    actAsActor(actor);
    const handler = await route(c.file, c.method);
    const request = new Request(`http://test.local/api/workspaces/${workspace.slug}${c.query ?? ""}`, {
      method: c.method,
      headers: { "content-type": "application/json" },
      body: c.body ? JSON.stringify(c.body()) : undefined,
    });
    const response = await handler(request, { params: Promise.resolve({ slug: workspace.slug, ...extra }) });
    const expected = c.expect[actor];
    expect(response.status).toBe(expected);
    if (expected === 302) return;
    const json = await response.json();
    if (expected < 300) {
      if (c.dataKey) expect(json[c.dataKey]).toBeDefined();
      if (actor === "student" && Array.isArray(json.items)) expect(json.items).toEqual([]);
    } else {
      expect(Object.keys(json).sort()).toEqual(["error", "message"]);
      expect(JSON.stringify(json)).not.toContain(workspace.name);
    }
  });
});

/**
 * Routes of one class session: the session's workspace decides (lib/classroom/session-guard.ts).
 * Hosts control, ask and see the tally; watchers (and builders once they joined with the code)
 * follow the session; participants answer, the host does not.
 */
interface SessionRouteCase {
  file: string;
  method: "GET" | "POST";
  expect: Expect;
  params?: () => Promise<Record<string, string>>;
  body?: () => Promise<Record<string, unknown>>;
  dataKey?: string;
  /** Server-Sent Events: the first event must be a snapshot. */
  stream?: boolean;
}

const HOSTS: Role[] = ["owner", "instructor"];
const WATCHERS: Role[] = ["owner", "technician", "instructor", "student"];
const CS = "app/api/class-sessions/[sessionId]";
let classSessionId = "";

async function freshQuestion(): Promise<string> {
  const { askQuestion } = await import("@/lib/classroom/questions");
  return (await askQuestion(classSessionId, { prompt: "Which fault?", choices: ["Steel nearby", "Not turned over"] })).id;
}

const SESSION_ROUTES: SessionRouteCase[] = [
  { file: `${CS}/events/route.ts`, method: "GET", expect: expectFor(200, WATCHERS), stream: true },
  { file: `${CS}/state/route.ts`, method: "GET", expect: expectFor(200, WATCHERS), dataKey: "live" },
  {
    file: `${CS}/control/route.ts`,
    method: "POST",
    expect: expectFor(200, HOSTS),
    body: async () => ({ action: "step" }),
    dataKey: "snapshot",
  },
  {
    file: `${CS}/questions/route.ts`,
    method: "POST",
    expect: expectFor(201, HOSTS),
    body: async () => ({ prompt: "Pass or fail?", choices: ["Pass", "Fail"] }),
    dataKey: "question",
  },
  {
    file: `${CS}/questions/[questionId]/close/route.ts`,
    method: "POST",
    expect: expectFor(200, HOSTS),
    params: async () => ({ questionId: await freshQuestion() }),
    dataKey: "question",
  },
  { file: `${CS}/tally/route.ts`, method: "GET", expect: expectFor(200, HOSTS), dataKey: "questions" },
  {
    file: `${CS}/answers/route.ts`,
    method: "POST",
    expect: expectFor(200, ["technician", "student"]),
    body: async () => ({ questionId: await freshQuestion(), choice: 0 }),
    dataKey: "ok",
  },
];

describe("class session routes", () => {
  beforeAll(async () => {
    const { createClassSession } = await import("@/lib/data/class-sessions");
    classSessionId = (
      await createClassSession(workspace.id, users.owner.id, { scenarioId: fixtures.scenarioId, allowGuests: false, speed: 1 })
    ).id;
  });

  afterAll(async () => {
    const { stopLiveChannels } = await import("@/lib/classroom/live-channel");
    const { stopClassHub } = await import("@/lib/classroom/notify-hub");
    stopLiveChannels();
    await stopClassHub();
  });

  describe.each(SESSION_ROUTES)("$method $file", (c) => {
    test.each(ACTORS)("as %s", async (actor) => {
      const extra = c.params ? await c.params() : {};
      const body = c.body ? await c.body() : undefined;
      actAsActor(actor);
      const handler = await route(c.file, c.method);
      const abort = new AbortController();
      const request = new Request("http://test.local/api/class-sessions", {
        method: c.method,
        headers: { "content-type": "application/json" },
        body: body ? JSON.stringify(body) : undefined,
        signal: abort.signal,
      });
      const response = await handler(request, { params: Promise.resolve({ sessionId: classSessionId, ...extra }) });
      const expected = c.expect[actor];
      expect(response.status).toBe(expected);
      if (expected < 300 && c.stream) {
        const { ServerSentEventReader } = await import("@/lib/classroom/sse-reader");
        const reader = new ServerSentEventReader(response.body!);
        expect((await reader.nextOf("snapshot")).event).toBe("snapshot");
        abort.abort();
        await reader.cancel();
        return;
      }
      const json = await response.json();
      if (expected < 300) {
        if (c.dataKey) expect(json[c.dataKey]).toBeDefined();
      } else {
        expect(Object.keys(json).sort()).toEqual(["error", "message"]);
        expect(JSON.stringify(json)).not.toContain(workspace.name);
      }
    });
  });

  test("joining is public: the code decides, with or without a session", async () => {
    const join = await route("app/api/join/route.ts", "POST");
    const { joinCode } = (await db().models.ClassSession.findByPk(classSessionId))!;
    const post = () =>
      join(
        new Request("http://test.local/api/join", {
          method: "POST",
          headers: { "content-type": "application/json" },
          body: JSON.stringify({ code: joinCode, displayName: "Visitor" }),
        }),
        { params: Promise.resolve({}) },
      );
    actAs(null);
    const anonymous = await post();
    expect(anonymous.status).toBe(400);
    expect((await anonymous.json()).error).toBe("sign-in-required");
    actAsActor("builder");
    expect(await (await post()).json()).toEqual({ sessionId: classSessionId, viewerPath: `/live/${classSessionId}` });
  });
});

describe("user routes", () => {
  test.each([
    ["app/api/me/route.ts", "GET"],
    ["app/api/workspaces/route.ts", "GET"],
    ["app/api/workspaces/route.ts", "POST"],
  ])("%s %s: 401 anonymous, only the caller's own workspaces otherwise", async (file, method) => {
    const handler = await route(file, method);
    const makeRequest = () =>
      new Request("http://test.local/api", {
        method,
        headers: { "content-type": "application/json" },
        body: method === "POST" ? JSON.stringify({ name: "Outsider's second", slug: `second-${uniqueTag()}`, kind: "school" }) : undefined,
      });
    actAs(null);
    expect((await handler(makeRequest(), { params: Promise.resolve({}) })).status).toBe(401);
    actAsActor("outsider");
    const response = await handler(makeRequest(), { params: Promise.resolve({}) });
    expect(response.status).toBe(method === "POST" ? 201 : 200);
    expect(JSON.stringify(await response.json())).not.toContain(workspace.slug);
  });

  test("health answers without a session and says nothing private", async () => {
    actAs(null);
    const response = await (await route("app/api/health/route.ts", "GET"))(new Request("http://test.local/api/health"), {});
    expect(response.status).toBe(200);
    expect(await response.json()).toEqual({ status: "ok" });
  });
});

interface WorkspaceActionCase {
  name: string;
  allowed: Role[];
  /** Valid input for one call, creating whatever the call acts on. */
  input: () => Promise<Record<string, string>>;
  /** Did the call change anything? Used to prove a denied call wrote nothing. */
  changed: (input: Record<string, string>) => Promise<boolean>;
}

async function freshMember(): Promise<Record<string, string>> {
  const user = await makeUser("victim");
  await addMember(workspace, user, "builder");
  const membership = await db().models.Membership.findOne({ where: { workspaceId: workspace.id, userId: user.id } });
  return { membershipId: membership!.id };
}

/** A run uploaded and processed by the owner, ready to be signed off. */
async function freshProcessedRun(): Promise<Record<string, string>> {
  const { uploadRun, simulatedCsv } = await import("../support/runs");
  const { processRunVersion } = await import("@/lib/jobs/process-run-version");
  actAs(users.owner.id);
  const { runId } = await uploadRun(workspace, { vehicleId: fixtures.vehicleId, csv: simulatedCsv({ seed: 9, pathSeconds: 20 }) });
  const run = await db().models.Run.findByPk(runId);
  await processRunVersion(run!.currentVersionId!);
  return { runId, versionId: run!.currentVersionId!, comment: "Checked on the bench." };
}

const WORKSPACE_ACTIONS: WorkspaceActionCase[] = [
  {
    name: "sign-off-run",
    allowed: ["owner", "technician"],
    input: freshProcessedRun,
    changed: async (input) => (await db().models.Run.findByPk(input.runId))!.signedOffVersionId === input.versionId,
  },
  {
    name: "update-workspace",
    allowed: ["owner"],
    input: async () => ({ name: `Renamed ${uniqueTag()}`, kind: "operator" }),
    changed: async (input) => (await db().models.Workspace.findByPk(workspace.id))!.name === input.name,
  },
  {
    name: "invite-member",
    allowed: ["owner"],
    input: async () => ({ email: `inv-${uniqueTag()}@tests.example`, role: "technician" }),
    changed: async (input) => (await db().models.Invitation.count({ where: { email: input.email } })) > 0,
  },
  {
    name: "revoke-invitation",
    allowed: ["owner"],
    input: async () => {
      const invitation = await inviteMember({
        workspaceId: workspace.id,
        inviterId: users.owner.id,
        email: `rev-${uniqueTag()}@tests.example`,
        role: "student",
      });
      return { invitationId: invitation.id };
    },
    changed: async (input) => Boolean((await db().models.Invitation.findByPk(input.invitationId))!.revokedAt),
  },
  {
    name: "change-member-role",
    allowed: ["owner"],
    input: async () => ({ ...(await freshMember()), role: "technician" }),
    changed: async (input) => (await db().models.Membership.findByPk(input.membershipId))!.role === "technician",
  },
  {
    name: "remove-member",
    allowed: ["owner"],
    input: freshMember,
    changed: async (input) => (await db().models.Membership.findByPk(input.membershipId)) === null,
  },
];

describe.each(WORKSPACE_ACTIONS)("action $name", (c) => {
  test.each(ACTORS)("as %s", async (actor) => {
    const input = await c.input();
    actAsActor(actor);
    const run = await action(c.name);
    const state = await run(idle, form({ workspace: workspace.slug, ...input }));
    if (actor !== "anonymous" && actor !== "outsider" && c.allowed.includes(actor)) {
      expect(state.status).toBe("ok");
      expect(await c.changed(input)).toBe(true);
    } else {
      const code = actor === "anonymous" ? "unauthenticated" : actor === "outsider" ? "not-found" : "forbidden";
      expect(state).toMatchObject({ status: "error", code });
      expect(JSON.stringify(state)).not.toContain(workspace.name);
      expect(await c.changed(input)).toBe(false);
    }
  });
});

describe("actions outside a workspace", () => {
  test.each(["create-workspace", "accept-invitation"])("%s needs a session", async (name) => {
    actAs(null);
    const state = await (
      await action(name)
    )(idle, form({ name: "X workspace", slug: `x-${uniqueTag()}`, kind: "other", token: "x".repeat(20) }));
    expect(state).toMatchObject({ status: "error", code: "unauthenticated" });
  });

  test("accept-invitation works only for the invited address", async () => {
    const email = `only-${uniqueTag()}@tests.example`;
    const { newToken } = await import("@/lib/tokens");
    const { token, tokenHash } = newToken();
    await db().models.Invitation.create({
      workspaceId: workspace.id,
      email,
      role: "student",
      tokenHash,
      invitedById: users.owner.id,
      expiresAt: new Date(Date.now() + 3600_000),
    });
    actAsActor("outsider");
    const state = await (await action("accept-invitation"))(idle, form({ token }));
    expect(state).toMatchObject({ status: "error", message: expect.stringContaining(email) });
    expect(await db().models.Membership.count({ where: { workspaceId: workspace.id, userId: users.outsider.id } })).toBe(0);
  });

  test("the last owner can neither leave the owner role nor be removed", async () => {
    const owner = await makeUser("solo");
    const solo = await makeWorkspace(owner, "solo");
    const membership = await db().models.Membership.findOne({ where: { workspaceId: solo.id, userId: owner.id } });
    actAs(owner.id);
    const demote = await (
      await action("change-member-role")
    )(idle, form({ workspace: solo.slug, membershipId: membership!.id, role: "builder" }));
    expect(demote).toMatchObject({ status: "error", message: expect.stringMatching(/at least one owner/) });
    const remove = await (await action("remove-member"))(idle, form({ workspace: solo.slug, membershipId: membership!.id }));
    expect(remove).toMatchObject({ status: "error", message: expect.stringMatching(/last owner/) });
  });

  test("a membership id from another workspace is not found, even for an owner", async () => {
    const other = await makeUser("foreign");
    const otherWs = await makeWorkspace(other, "foreign");
    const foreign = await db().models.Membership.findOne({ where: { workspaceId: otherWs.id } });
    actAsActor("owner");
    const state = await (await action("remove-member"))(idle, form({ workspace: workspace.slug, membershipId: foreign!.id }));
    expect(state.status).toBe("error");
    expect(await db().models.Membership.findByPk(foreign!.id)).not.toBeNull();
  });
});

describe("completeness", () => {
  function walk(dir: string): string[] {
    return fs
      .readdirSync(dir, { withFileTypes: true })
      .flatMap((e) => (e.isDirectory() ? walk(path.join(dir, e.name)) : [path.join(dir, e.name)]));
  }

  test("every route handler is walked above", async () => {
    const covered = new Set([
      ...WORKSPACE_ROUTES.map((c) => `${c.method} ${c.file}`),
      "GET app/api/tokens/route.ts",
      "POST app/api/tokens/route.ts",
      "DELETE app/api/tokens/[tokenId]/route.ts",
      "GET app/api/me/route.ts",
      "GET app/api/workspaces/route.ts",
      "POST app/api/workspaces/route.ts",
      "GET app/api/health/route.ts",
      ...SESSION_ROUTES.map((c) => `${c.method} ${c.file}`),
      "POST app/api/join/route.ts",
    ]);
    const found: string[] = [];
    for (const file of walk("app").filter((f) => f.endsWith("route.ts"))) {
      const mod = await import(/* @vite-ignore */ path.resolve(file));
      for (const method of ["GET", "POST", "PUT", "PATCH", "DELETE"]) if (method in mod) found.push(`${method} ${file}`);
    }
    expect(found.filter((entry) => !covered.has(entry))).toEqual([]);
  });

  test("every server action is walked above", () => {
    const covered = new Set([
      ...WORKSPACE_ACTIONS.map((c) => c.name),
      "create-workspace",
      "accept-invitation",
      // Public by design; their behaviour is covered in accounts.test.ts.
      "sign-in",
      "sign-up",
      "sign-out",
      "request-password-reset",
      "reset-password",
    ]);
    const found = fs.readdirSync("lib/actions").map((f) => f.replace(/\.ts$/, ""));
    expect(found.filter((name) => !covered.has(name))).toEqual([]);
  });
});

describe("personal API tokens", () => {
  test("a token acts as its owner; revoked or unknown tokens are refused, never rescued by a session", async () => {
    const { createApiToken } = await import("@/lib/data/api-tokens");
    const { token, summary } = await createApiToken(users.technician.id, "bench rig");
    expect(token).toMatch(/^lox_/);
    const stored = await db().models.ApiToken.findByPk(summary.id);
    expect(stored!.tokenHash).not.toContain(token.slice(4));
    const me = await route("app/api/me/route.ts", "GET");
    const asToken = (t: string) => new Request("http://test.local/api/me", { headers: { authorization: `Bearer ${t}` } });
    actAs(null);
    const ok = await me(asToken(token), { params: Promise.resolve({}) });
    expect(ok.status).toBe(200);
    expect((await ok.json()).user.email).toBe(users.technician.email);
    // The token's user keeps their role: a technician's token cannot invite.
    const invite = await route("app/api/workspaces/[slug]/invitations/route.ts", "POST");
    const denied = await invite(
      new Request("http://test.local/x", {
        method: "POST",
        headers: { authorization: `Bearer ${token}`, "content-type": "application/json" },
        body: JSON.stringify({ email: "x@tests.example", role: "owner" }),
      }),
      { params: Promise.resolve({ slug: workspace.slug }) },
    );
    expect(denied.status).toBe(403);
    // Revoke through the route, then the token no longer works even with a signed-in session present.
    actAs(users.technician.id);
    const revoke = await route("app/api/tokens/[tokenId]/route.ts", "DELETE");
    expect(
      (await revoke(new Request("http://test.local/x", { method: "DELETE" }), { params: Promise.resolve({ tokenId: summary.id }) })).status,
    ).toBe(200);
    expect((await me(asToken(token), { params: Promise.resolve({}) })).status).toBe(401);
    expect((await me(asToken("lox_not-a-real-token"), { params: Promise.resolve({}) })).status).toBe(401);
    // Someone else's token id cannot be revoked.
    const other = await createApiToken(users.owner.id, "owner's");
    expect(
      (await revoke(new Request("http://test.local/x", { method: "DELETE" }), { params: Promise.resolve({ tokenId: other.summary.id }) }))
        .status,
    ).toBe(404);
  });
});
