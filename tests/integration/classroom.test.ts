/**
 * Class sessions through the real route handlers and PostgreSQL: scenarios, the join code
 * (valid, wrong, expired, ended, guests allowed or not), who may do what, a question round,
 * the playback rule at given clock values, live updates over Server-Sent Events with
 * reconnection (fan-out through LISTEN/NOTIFY), and the run saved when a session ends.
 */
import path from "node:path";
import { afterAll, afterEach, beforeAll, describe, expect, test } from "vitest";
import { DEFAULT_SCENARIO, type ScenarioSpec } from "@/geometry/scenario";
import { stopLiveChannels } from "@/lib/classroom/live-channel";
import { stopClassHub } from "@/lib/classroom/notify-hub";
import { samplesPerTick, setClassroomClock } from "@/lib/classroom/playback-clock";
import { snapshotCacheCounts } from "@/lib/classroom/snapshot-cache";
import { ServerSentEventReader } from "@/lib/classroom/sse-reader";
import type { SessionSnapshot } from "@/lib/data/class-sessions";
import type { Tally } from "@/lib/classroom/questions";
import type { UserSummary } from "@/lib/data/users";
import type { WorkspaceSummary } from "@/lib/data/workspaces";
import { closeDb, db } from "@/lib/db";
import { processRunVersion } from "@/lib/jobs/process-run-version";
import { stopQueue } from "@/lib/jobs/queue";
import { addMember, makeUser, makeWorkspace, uniqueTag } from "../support/factories";
import { actAs } from "../support/request-context";

type Handler = (request: Request, context: { params: Promise<Record<string, string>> }) => Promise<Response>;

const WS = "app/api/workspaces/[slug]";
const CS = "app/api/class-sessions/[sessionId]";

/** Call a route handler as Next would; `cookie` is sent as the Cookie header. */
async function call(
  file: string,
  method: string,
  params: Record<string, string>,
  options: { body?: unknown; cookie?: string; signal?: AbortSignal } = {},
): Promise<{ status: number; json: Record<string, unknown>; response: Response }> {
  const mod = (await import(/* @vite-ignore */ path.resolve(file))) as Record<string, Handler>;
  const headers: Record<string, string> = { "content-type": "application/json" };
  if (options.cookie) headers.cookie = options.cookie;
  const request = new Request("http://test.local/api", {
    method,
    headers,
    body: options.body === undefined ? undefined : JSON.stringify(options.body),
    signal: options.signal,
  });
  const response = await mod[method](request, { params: Promise.resolve(params) });
  if (response.headers.get("content-type")?.startsWith("text/event-stream")) return { status: response.status, json: {}, response };
  const text = await response.text();
  return { status: response.status, json: text ? JSON.parse(text) : {}, response };
}

/** The cookie a Set-Cookie header asks the browser to keep, as it would send it back. */
function cookieFrom(response: Response): string {
  const header = response.headers.get("set-cookie");
  if (!header) throw new Error("no Set-Cookie header");
  return header.split(";")[0];
}

let host: UserSummary;
let instructor: UserSummary;
let technician: UserSummary;
let builder: UserSummary;
let student: UserSummary;
let outsider: UserSummary;
let workspace: WorkspaceSummary;
let otherWorkspace: WorkspaceSummary;
let scenarioId: string;

/** A short full tumble at 25 Hz: 1500 samples, quick to analyse. */
const SPEC: ScenarioSpec = { ...DEFAULT_SCENARIO, pathSeconds: 60 };

async function newSession(options: { allowGuests?: boolean; speed?: number } = {}): Promise<{ id: string; joinCode: string }> {
  actAs(host.id);
  const created = await call(`${WS}/class-sessions/route.ts`, "POST", { slug: workspace.slug }, { body: { scenarioId, ...options } });
  expect(created.status).toBe(201);
  return created.json.session as { id: string; joinCode: string };
}

async function state(sessionId: string, as: string | null, cookie?: string): Promise<SessionSnapshot> {
  actAs(as);
  const answer = await call(`${CS}/state/route.ts`, "GET", { sessionId }, { cookie });
  expect(answer.status).toBe(200);
  return answer.json as unknown as SessionSnapshot;
}

async function control(sessionId: string, body: Record<string, unknown>, as = host.id) {
  actAs(as);
  return call(`${CS}/control/route.ts`, "POST", { sessionId }, { body });
}

async function join(body: Record<string, unknown>, as: string | null, cookie?: string) {
  actAs(as);
  return call("app/api/join/route.ts", "POST", {}, { body, cookie });
}

beforeAll(async () => {
  host = await makeUser("host");
  workspace = await makeWorkspace(host, "class");
  instructor = await makeUser("instructor");
  technician = await makeUser("technician");
  builder = await makeUser("builder");
  student = await makeUser("student");
  await addMember(workspace, instructor, "instructor");
  await addMember(workspace, technician, "technician");
  await addMember(workspace, builder, "builder");
  await addMember(workspace, student, "student");
  outsider = await makeUser("outsider");
  otherWorkspace = await makeWorkspace(outsider, "elsewhere");
  actAs(host.id);
  const created = await call(
    `${WS}/scenarios/route.ts`,
    "POST",
    { slug: workspace.slug },
    { body: { name: "Clean tumble", description: "A good calibration.", spec: SPEC, answer: "Nothing is wrong." } },
  );
  expect(created.status).toBe(201);
  scenarioId = (created.json.scenario as { id: string }).id;
});

afterEach(() => setClassroomClock());

afterAll(async () => {
  stopLiveChannels();
  await stopClassHub();
  await stopQueue();
  await closeDb();
});

describe("scenarios", () => {
  test("saved, listed, changed, duplicated and deleted within the workspace", async () => {
    actAs(instructor.id);
    const made = await call(
      `${WS}/scenarios/route.ts`,
      "POST",
      { slug: workspace.slug },
      { body: { name: `Steel ${uniqueTag()}`, spec: { ...SPEC, steel: { distanceM: 0.6 } }, answer: "Steel nearby." } },
    );
    expect(made.status).toBe(201);
    const id = (made.json.scenario as { id: string }).id;
    const list = await call(`${WS}/scenarios/route.ts`, "GET", { slug: workspace.slug });
    expect((list.json.scenarios as { id: string }[]).map((s) => s.id)).toContain(id);

    const renamed = await call(
      `${WS}/scenarios/[scenarioId]/route.ts`,
      "PATCH",
      { slug: workspace.slug, scenarioId: id },
      { body: { answer: "A steel container 0.6 m away." } },
    );
    expect(renamed.status).toBe(200);
    expect(renamed.json.scenario).toMatchObject({ answer: "A steel container 0.6 m away.", spec: { steel: { distanceM: 0.6 } } });

    const copy = await call(`${WS}/scenarios/[scenarioId]/duplicate/route.ts`, "POST", { slug: workspace.slug, scenarioId: id });
    const copy2 = await call(`${WS}/scenarios/[scenarioId]/duplicate/route.ts`, "POST", { slug: workspace.slug, scenarioId: id });
    const name = (made.json.scenario as { name: string }).name;
    expect(copy.status).toBe(201);
    expect((copy.json.scenario as { name: string; readyMade: boolean }).name).toBe(`${name} (copy)`);
    expect((copy2.json.scenario as { name: string }).name).toBe(`${name} (copy 2)`);

    const taken = await call(`${WS}/scenarios/route.ts`, "POST", { slug: workspace.slug }, { body: { name, spec: SPEC } });
    expect(taken.status).toBe(409);
    expect(taken.json.fields).toHaveProperty("name");

    expect((await call(`${WS}/scenarios/[scenarioId]/route.ts`, "DELETE", { slug: workspace.slug, scenarioId: id })).status).toBe(200);
    expect((await call(`${WS}/scenarios/[scenarioId]/route.ts`, "GET", { slug: workspace.slug, scenarioId: id })).status).toBe(404);
  });

  test("each bad field is named", async () => {
    actAs(host.id);
    const bad = await call(
      `${WS}/scenarios/route.ts`,
      "POST",
      { slug: workspace.slug },
      {
        body: {
          name: "",
          spec: {
            ...SPEC,
            sampleRateHz: 1000,
            hardIronOffset: [1, 2],
            secondCompass: { mountingRotation: "x-forward.z-forward", declaredRotation: "x-forward.z-down", hardIronOffset: [0, 0, 0] },
          },
        },
      },
    );
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.json.fields as object)).toEqual(
      expect.arrayContaining(["name", "spec.sampleRateHz", "spec.hardIronOffset", "spec.secondCompass.mountingRotation"]),
    );
  });

  test("another workspace's scenarios are never listed or fetched, not even by its owner", async () => {
    actAs(outsider.id);
    const theirs = await call(
      `${WS}/scenarios/route.ts`,
      "POST",
      { slug: otherWorkspace.slug },
      { body: { name: "Elsewhere", spec: SPEC } },
    );
    expect(theirs.status).toBe(201);
    const theirId = (theirs.json.scenario as { id: string }).id;
    actAs(host.id);
    const ours = await call(`${WS}/scenarios/route.ts`, "GET", { slug: workspace.slug });
    expect((ours.json.scenarios as { id: string }[]).map((s) => s.id)).not.toContain(theirId);
    expect((await call(`${WS}/scenarios/[scenarioId]/route.ts`, "GET", { slug: workspace.slug, scenarioId: theirId })).status).toBe(404);
    expect(
      (await call(`${WS}/scenarios/[scenarioId]/duplicate/route.ts`, "POST", { slug: workspace.slug, scenarioId: theirId })).status,
    ).toBe(404);
    const started = await call(`${WS}/class-sessions/route.ts`, "POST", { slug: workspace.slug }, { body: { scenarioId: theirId } });
    expect(started.status).toBe(409);
    expect(started.json.fields).toHaveProperty("scenarioId");
    // And the outsider cannot reach ours through their own workspace's address.
    actAs(outsider.id);
    expect((await call(`${WS}/scenarios/[scenarioId]/route.ts`, "GET", { slug: otherWorkspace.slug, scenarioId })).status).toBe(404);
    expect((await call(`${WS}/scenarios/route.ts`, "GET", { slug: workspace.slug })).status).toBe(404);
  });

  test("students may not see scenarios", async () => {
    actAs(student.id);
    expect((await call(`${WS}/scenarios/route.ts`, "GET", { slug: workspace.slug })).status).toBe(403);
  });
});

describe("join code", () => {
  test("a member joins with the code, in any case and spacing; a wrong code is refused", async () => {
    const session = await newSession();
    expect(session.joinCode).toMatch(/^[A-Z0-9]{6}$/);
    const typed = `${session.joinCode.slice(0, 3).toLowerCase()} ${session.joinCode.slice(3)}`;
    const joined = await join({ code: typed }, student.id);
    expect(joined.status).toBe(200);
    expect(joined.json).toEqual({ sessionId: session.id, viewerPath: `/live/${session.id}` });
    expect(joined.response.headers.get("set-cookie")).toMatch(/^loxodrome_participant=.+HttpOnly; SameSite=Lax/);

    // A code that names no session: pick one differing from the real one in its first letter.
    const wrong = `${session.joinCode[0] === "A" ? "C" : "A"}${session.joinCode.slice(1)}`;
    const refused = await join({ code: wrong }, student.id);
    expect(refused.status).toBe(404);
    expect(refused.json).toMatchObject({ message: "No live session has that code.", fields: { code: expect.any(String) } });
    const short = await join({ code: "ABC" }, student.id);
    expect(short.status).toBe(400);
    expect(short.json.fields).toHaveProperty("code");
  });

  test("an expired code is refused, and the session has ended", async () => {
    const session = await newSession();
    await db().models.ClassSession.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { id: session.id } });
    const refused = await join({ code: session.joinCode }, student.id);
    expect(refused.status).toBe(400);
    expect(refused.json).toMatchObject({ error: "expired", message: "That code has expired." });
    expect((await state(session.id, host.id)).status).toBe("ended");
  });

  test("an ended session refuses joins and controls", async () => {
    const session = await newSession();
    expect((await control(session.id, { action: "end" })).status).toBe(200);
    const refused = await join({ code: session.joinCode }, student.id);
    expect(refused.status).toBe(400);
    expect(refused.json).toMatchObject({ error: "ended", message: "That session has ended." });
    const late = await control(session.id, { action: "play" });
    expect(late.status).toBe(409);
    expect(late.json.message).toBe("That session has ended.");
  });

  test("guests: refused unless the host allowed them; then a display name is needed, and the cookie is their seat", async () => {
    const closed = await newSession({ allowGuests: false });
    const noGuests = await join({ code: closed.joinCode, displayName: "Sam" }, null);
    expect(noGuests.status).toBe(400);
    expect(noGuests.json).toMatchObject({ error: "sign-in-required", message: "Sign in to join this session." });
    // A signed-in non-member is a guest too.
    expect((await join({ code: closed.joinCode }, outsider.id)).json).toMatchObject({ error: "members-only" });

    const open = await newSession({ allowGuests: true });
    const nameless = await join({ code: open.joinCode }, null);
    expect(nameless.status).toBe(400);
    expect(nameless.json.fields).toHaveProperty("displayName");
    const joined = await join({ code: open.joinCode, displayName: "Sam" }, null);
    expect(joined.status).toBe(200);
    const cookie = cookieFrom(joined.response);

    const seen = await state(open.id, null, cookie);
    expect(seen).toMatchObject({ role: "participant", joinCode: null, answer: null, participants: 1 });
    // Joining again from the same browser keeps the seat.
    const again = await join({ code: open.joinCode, displayName: "Sam" }, null, cookie);
    expect(again.status).toBe(200);
    expect((await state(open.id, host.id)).participants).toBe(1);
    // The cookie is a seat in that session only.
    actAs(null);
    expect((await call(`${CS}/state/route.ts`, "GET", { sessionId: closed.id }, { cookie })).status).toBe(401);
    // A forged cookie is no seat at all.
    expect((await call(`${CS}/state/route.ts`, "GET", { sessionId: open.id }, { cookie: "loxodrome_participant=forged" })).status).toBe(
      401,
    );
  });
});

describe("permissions", () => {
  test("only hosts control and see the tally; participants and guests get 403, outsiders 404, nobody 401", async () => {
    const session = await newSession({ allowGuests: true });
    const guest = cookieFrom((await join({ code: session.joinCode, displayName: "Ari" }, null)).response);
    const cases: [string, string | null, string | undefined, number, number, number][] = [
      // who, user, cookie, control, tally, state
      ["owner (host)", host.id, undefined, 200, 200, 200],
      ["instructor", instructor.id, undefined, 200, 200, 200],
      ["technician", technician.id, undefined, 403, 403, 200],
      ["student", student.id, undefined, 403, 403, 200],
      ["builder who has not joined", builder.id, undefined, 403, 403, 403],
      ["guest", null, guest, 403, 403, 200],
      ["member of another workspace", outsider.id, undefined, 404, 404, 404],
      ["nobody", null, undefined, 401, 401, 401],
    ];
    for (const [who, user, cookie, controlStatus, tallyStatus, stateStatus] of cases) {
      actAs(user);
      const acted = await call(`${CS}/control/route.ts`, "POST", { sessionId: session.id }, { body: { action: "step" }, cookie });
      expect(acted.status, `${who}: control`).toBe(controlStatus);
      expect((await call(`${CS}/tally/route.ts`, "GET", { sessionId: session.id }, { cookie })).status, `${who}: tally`).toBe(tallyStatus);
      expect((await call(`${CS}/state/route.ts`, "GET", { sessionId: session.id }, { cookie })).status, `${who}: state`).toBe(stateStatus);
    }
    // Once the builder joins with the code, they may watch.
    expect((await join({ code: session.joinCode }, builder.id)).status).toBe(200);
    expect((await state(session.id, builder.id)).role).toBe("participant");
  });

  test("the host sees the code and the answer; participants see the answer only once revealed", async () => {
    const session = await newSession();
    const forHost = await state(session.id, host.id);
    expect(forHost).toMatchObject({ role: "host", joinCode: session.joinCode, answer: "Nothing is wrong." });
    expect((await state(session.id, student.id)).answer).toBeNull();
    await control(session.id, { action: "reveal" });
    expect(await state(session.id, student.id)).toMatchObject({ answerRevealed: true, answer: "Nothing is wrong." });
    await control(session.id, { action: "hide" });
    expect((await state(session.id, student.id)).answer).toBeNull();
  });

  test("the sessions list shows join codes only to those who may host", async () => {
    const session = await newSession();
    actAs(host.id);
    const forHost = await call(`${WS}/class-sessions/route.ts`, "GET", { slug: workspace.slug });
    expect((forHost.json.sessions as { id: string; joinCode: string | null }[]).find((s) => s.id === session.id)?.joinCode).toBe(
      session.joinCode,
    );
    actAs(student.id);
    const forStudent = await call(`${WS}/class-sessions/route.ts`, "GET", { slug: workspace.slug });
    const row = (forStudent.json.sessions as { id: string; joinCode: string | null; hostName: string }[]).find((s) => s.id === session.id);
    expect(row).toMatchObject({ joinCode: null, hostName: host.name, scenarioName: "Clean tumble", status: "waiting" });
  });
});

describe("a question round", () => {
  test("ask, answer, change the answer, close, tally", async () => {
    const session = await newSession({ allowGuests: true });
    const guest = cookieFrom((await join({ code: session.joinCode, displayName: "Ari" }, null)).response);
    actAs(host.id);
    const asked = await call(
      `${CS}/questions/route.ts`,
      "POST",
      { sessionId: session.id },
      { body: { prompt: "What is wrong with this compass?", choices: ["Nothing", "Steel nearby", "Not turned over"] } },
    );
    expect(asked.status).toBe(201);
    const questionId = (asked.json.question as { id: string }).id;
    const tooFew = await call(
      `${CS}/questions/route.ts`,
      "POST",
      { sessionId: session.id },
      { body: { prompt: "?", choices: ["Only one"] } },
    );
    expect(tooFew.status).toBe(400);
    expect(tooFew.json.fields).toHaveProperty("choices");

    const answer = async (user: string | null, choice: number, cookie?: string) => {
      actAs(user);
      return call(`${CS}/answers/route.ts`, "POST", { sessionId: session.id }, { body: { questionId, choice }, cookie });
    };
    expect((await answer(student.id, 1)).json).toEqual({ ok: true });
    expect((await answer(technician.id, 0)).status).toBe(200);
    expect((await answer(null, 2, guest)).status).toBe(200);
    expect((await answer(student.id, 0)).status).toBe(200); // changes their mind
    expect((await answer(student.id, 9)).status).toBe(409);
    expect((await answer(host.id, 0)).status).toBe(403); // the host asks; participants answer

    expect((await state(session.id, student.id)).question).toMatchObject({ id: questionId, open: true, myChoice: 0 });
    expect((await state(session.id, null, guest)).question?.myChoice).toBe(2);
    expect((await state(session.id, host.id)).question?.myChoice).toBeNull();

    actAs(host.id);
    expect((await call(`${CS}/questions/[questionId]/close/route.ts`, "POST", { sessionId: session.id, questionId })).status).toBe(200);
    const late = await answer(student.id, 1);
    expect(late.status).toBe(409);
    expect(late.json.message).toBe("That question is closed.");

    actAs(host.id);
    const tally = (await call(`${CS}/tally/route.ts`, "GET", { sessionId: session.id })).json as unknown as Tally;
    expect(tally.questions).toHaveLength(1);
    expect(tally.questions[0]).toMatchObject({ open: false, counts: [2, 0, 1] });
    expect(tally.questions[0].answers).toEqual(
      expect.arrayContaining([
        { participant: student.name, choice: 0 },
        { participant: technician.name, choice: 0 },
        { participant: "Ari (guest)", choice: 2 },
      ]),
    );
  });
});

describe("the playback rule", () => {
  test("positions at given clock values, through play, speed, freeze, step, restart and pause", async () => {
    let now = Date.UTC(2026, 11, 2, 10, 0, 0);
    setClassroomClock(() => now);
    const session = await newSession();
    const rate = SPEC.sampleRateHz;
    const position = async () => (await state(session.id, student.id)).live.position;
    expect(await position()).toBe(0);

    await control(session.id, { action: "play" });
    now += 999;
    expect(await position()).toBe(0);
    now += 1; // one tick
    expect(await position()).toBe(samplesPerTick(1, rate));
    now += 3500; // 4.5 s since play: four ticks
    expect(await position()).toBe(4 * rate);

    await control(session.id, { action: "speed", speed: 2 }); // re-based at 100
    now += 2000;
    expect(await position()).toBe(4 * rate + 2 * samplesPerTick(2, rate));

    await control(session.id, { action: "freeze" });
    const frozenAt = await position();
    now += 10_000;
    expect(await state(session.id, student.id)).toMatchObject({ frozen: true, live: { position: frozenAt } });
    await control(session.id, { action: "unfreeze" });
    now += 1000;
    expect(await position()).toBe(frozenAt + samplesPerTick(2, rate));

    await control(session.id, { action: "pause" });
    const pausedAt = await position();
    now += 5000;
    expect(await position()).toBe(pausedAt);
    await control(session.id, { action: "step", stepSeconds: 10 });
    expect(await position()).toBe(pausedAt + 10 * rate);
    await control(session.id, { action: "step" });
    expect(await position()).toBe(pausedAt + 15 * rate);
    await control(session.id, { action: "restart" });
    expect(await state(session.id, student.id)).toMatchObject({ playing: false, live: { position: 0 } });

    // Played to the end, it stops there and says it is no longer playing.
    await control(session.id, { action: "speed", speed: 8 });
    await control(session.id, { action: "play" });
    now += 3_600_000;
    const end = await state(session.id, student.id);
    expect(end.live.position).toBe(end.live.totalSamples);
    expect(end.playing).toBe(false);
    expect(end.live.verdict).toBe("pass");
  });

  test("each control adds one state version; the same (state version, position) gives the same bytes, computed once", async () => {
    const session = await newSession();
    const first = await state(session.id, student.id);
    const stepped = await control(session.id, { action: "step", stepSeconds: 20 });
    expect((stepped.json.snapshot as SessionSnapshot).stateVersion).toBe(first.stateVersion + 1);
    // The first read computes the snapshot at this position; the next reads reuse it byte for byte.
    await state(session.id, student.id);
    const before = snapshotCacheCounts();
    const texts: string[] = [];
    for (const user of [student.id, technician.id]) {
      actAs(user);
      const mod = (await import(/* @vite-ignore */ path.resolve(`${CS}/state/route.ts`))) as Record<string, Handler>;
      texts.push(
        await (await mod.GET(new Request("http://test.local/api"), { params: Promise.resolve({ sessionId: session.id }) })).text(),
      );
    }
    expect(texts[0]).toBe(texts[1]);
    expect(snapshotCacheCounts().snapshotsBuilt).toBe(before.snapshotsBuilt);
  });
});

describe("live updates over Server-Sent Events", () => {
  async function connect(sessionId: string, user: string | null, cookie?: string) {
    const abort = new AbortController();
    actAs(user);
    const opened = await call(`${CS}/events/route.ts`, "GET", { sessionId }, { cookie, signal: abort.signal });
    expect(opened.status).toBe(200);
    expect(opened.response.headers.get("content-type")).toMatch(/^text\/event-stream/);
    expect(opened.response.headers.get("cache-control")).toMatch(/no-store/);
    expect(opened.response.headers.get("x-accel-buffering")).toBe("no");
    return { reader: new ServerSentEventReader(opened.response.body!), abort };
  }
  const parse = (data: string) => JSON.parse(data) as SessionSnapshot;

  test("the first event is the snapshot; a control brings a newer one to every viewer; a reconnect starts from the full state", async () => {
    const session = await newSession({ allowGuests: true });
    const guest = cookieFrom((await join({ code: session.joinCode, displayName: "Ngaio" }, null)).response);
    const viewerA = await connect(session.id, student.id);
    const viewerB = await connect(session.id, null, guest);
    const hostStream = await connect(session.id, host.id);

    const firstA = await viewerA.reader.nextOf("snapshot");
    const firstB = await viewerB.reader.nextOf("snapshot");
    const snapA = parse(firstA.data);
    expect(snapA).toMatchObject({ sessionId: session.id, role: "participant", live: { position: 0 } });
    expect(firstA.id).toBe(`${snapA.stateVersion}.0.0`);
    expect(parse(firstB.data).stateVersion).toBe(snapA.stateVersion);
    expect(parse((await hostStream.reader.nextOf("snapshot")).data)).toMatchObject({ role: "host", joinCode: session.joinCode });
    expect(JSON.parse((await hostStream.reader.nextOf("tally")).data)).toEqual({ questions: [] });

    expect((await control(session.id, { action: "step", stepSeconds: 30 })).status).toBe(200);
    const newer = (event: { data: string }) => parse(event.data).stateVersion > snapA.stateVersion;
    const [afterA, afterB] = await Promise.all([
      viewerA.reader.nextOf("snapshot", 10_000, newer),
      viewerB.reader.nextOf("snapshot", 10_000, newer),
    ]);
    expect(parse(afterA.data).live.position).toBe(30 * SPEC.sampleRateHz);
    expect(parse(afterB.data).live.position).toBe(30 * SPEC.sampleRateHz);
    expect(parse(afterA.data).live.coverageFraction).toBeGreaterThan(0);

    // A dropped connection: the viewer leaves; meanwhile the host steps on and asks a question.
    viewerA.abort.abort();
    await viewerA.reader.cancel();
    await control(session.id, { action: "step", stepSeconds: 10 });
    actAs(host.id);
    await call(
      `${CS}/questions/route.ts`,
      "POST",
      { sessionId: session.id },
      { body: { prompt: "Pass or fail?", choices: ["Pass", "Fail"] } },
    );
    const latest = await state(session.id, student.id);
    // Reconnecting is connecting again: the first event is the full current state.
    const again = await connect(session.id, student.id);
    const resumed = parse((await again.reader.nextOf("snapshot")).data);
    expect(resumed.stateVersion).toBe(latest.stateVersion);
    expect(resumed.live.position).toBe(40 * SPEC.sampleRateHz);
    expect(resumed.question).toMatchObject({ prompt: "Pass or fail?", open: true, myChoice: null });

    // The guest answers: their own stream shows their choice, the host's tally counts it.
    const questionId = resumed.question!.id;
    actAs(null);
    await call(`${CS}/answers/route.ts`, "POST", { sessionId: session.id }, { body: { questionId, choice: 1 }, cookie: guest });
    const mine = await viewerB.reader.nextOf("snapshot", 10_000, (e) => parse(e.data).question?.myChoice === 1);
    expect(parse(mine.data).question?.myChoice).toBe(1);
    const tally = await hostStream.reader.nextOf("tally", 10_000, (e) => (JSON.parse(e.data) as Tally).questions[0]?.counts[1] === 1);
    expect((JSON.parse(tally.data) as Tally).questions[0].answers).toEqual([{ participant: "Ngaio (guest)", choice: 1 }]);

    for (const stream of [again, viewerB, hostStream]) {
      stream.abort.abort();
      await stream.reader.cancel();
    }
  });

  test("while it plays, one snapshot per tick, each a whole tick's samples further on", async () => {
    const session = await newSession();
    const viewer = await connect(session.id, student.id);
    await viewer.reader.nextOf("snapshot");
    const played = (await control(session.id, { action: "play" })).json.snapshot as SessionSnapshot;
    const perTick = samplesPerTick(1, SPEC.sampleRateHz);
    const seen: { position: number; id: string | null; at: number }[] = [];
    while (seen.length < 3) {
      const event = await viewer.reader.nextOf("snapshot", 5000, (e) => parse(e.data).stateVersion === played.stateVersion);
      seen.push({ position: parse(event.data).live.position, id: event.id, at: Date.now() });
    }
    // The first may still be position 0 (the play itself); after that one tick's samples each time, no repeats.
    const ticks = seen.map((s) => s.position / perTick);
    for (const tick of ticks) expect(Number.isInteger(tick)).toBe(true);
    for (let i = 1; i < ticks.length; i++) expect(ticks[i]).toBe(ticks[i - 1] + 1);
    expect(new Set(seen.map((s) => s.id)).size).toBe(seen.length);
    expect(seen[2].at - seen[1].at).toBeGreaterThan(800);
    viewer.abort.abort();
    await viewer.reader.cancel();
    await control(session.id, { action: "end" });
  });

  test("the host's closed tab does not end the session", async () => {
    const session = await newSession();
    const hostStream = await connect(session.id, host.id);
    await hostStream.reader.nextOf("snapshot");
    await control(session.id, { action: "play" });
    hostStream.abort.abort();
    await hostStream.reader.cancel();
    expect((await state(session.id, student.id)).status).toBe("live");
  });
});

describe("the end of a session", () => {
  test("ending saves the capture as a simulated run shared with students, processed by the usual queue", async () => {
    const session = await newSession();
    await control(session.id, { action: "step", stepSeconds: 30 });
    const ended = await control(session.id, { action: "end" });
    expect(ended.status).toBe(200);
    const snapshot = ended.json.snapshot as SessionSnapshot;
    expect(snapshot.status).toBe("ended");
    expect(snapshot.runId).toMatch(/^[0-9a-f-]{36}$/);
    expect(snapshot.runPath).toBe(`/w/${workspace.slug}/runs/${snapshot.runId}`);
    expect((await state(session.id, student.id)).runPath).toBe(snapshot.runPath);

    const run = await db().models.Run.findByPk(snapshot.runId!);
    expect(run).toMatchObject({
      simulated: true,
      sharedWithStudents: true,
      status: "uploaded",
      capturedOn: SPEC.date,
      powersMotors: false,
    });
    const vehicle = await db().models.Vehicle.findByPk(run!.vehicleId);
    expect(vehicle!.name).toBe("Classroom simulator");
    expect(await processRunVersion(run!.currentVersionId!)).toBe("done");
    const done = await db().models.Run.findByPk(run!.id);
    expect(done!.verdict).toBe("pass");
    // A second session reuses the vehicle and its compasses.
    const next = await newSession();
    await control(next.id, { action: "play" });
    const nextRun = ((await control(next.id, { action: "end" })).json.snapshot as SessionSnapshot).runId!;
    expect((await db().models.Run.findByPk(nextRun))!.vehicleId).toBe(run!.vehicleId);
    expect(await db().models.Vehicle.count({ where: { workspaceId: workspace.id, name: "Classroom simulator" } })).toBe(1);
  });

  test("a scenario that runs motors says so from the start, and its run is marked as powering motors", async () => {
    actAs(host.id);
    const made = await call(
      `${WS}/scenarios/route.ts`,
      "POST",
      { slug: workspace.slug },
      { body: { name: `Wiring ${uniqueTag()}`, spec: { ...SPEC, currentCoupling: { perAmpMicrotesla: [0.3, 0.1, -0.2], maxAmps: 30 } } } },
    );
    const created = await call(
      `${WS}/class-sessions/route.ts`,
      "POST",
      { slug: workspace.slug },
      { body: { scenarioId: (made.json.scenario as { id: string }).id } },
    );
    const session = created.json.session as { id: string };
    expect((await state(session.id, student.id)).powersMotors).toBe(true);
    await control(session.id, { action: "play" });
    const runId = ((await control(session.id, { action: "end" })).json.snapshot as SessionSnapshot).runId!;
    expect((await db().models.Run.findByPk(runId))!.powersMotors).toBe(true);
    expect((await state(session.id, host.id)).powersMotors).toBe(true);
  });

  test("a session that never started ends without a run", async () => {
    const session = await newSession();
    const ended = await control(session.id, { action: "end" });
    expect((ended.json.snapshot as SessionSnapshot).runId).toBeNull();
  });
});
