/**
 * A class session served by two app processes behind different ports, as a team running
 * several servers behind one address would: a viewer on each server (plain fetch reading the
 * Server-Sent Events body), the host acting on one of them. The fan-out goes through
 * PostgreSQL (LISTEN/NOTIFY), so both viewers see every change, and at the same (state
 * version, position) both servers send the same live view.
 */
import { spawn, type ChildProcess } from "node:child_process";
import path from "node:path";
import { afterAll, beforeAll, expect, inject, test } from "vitest";
import { DEFAULT_SCENARIO } from "@/geometry/scenario";
import { ServerSentEventReader, type ServerSentEvent } from "@/lib/classroom/sse-reader";
import { createApiToken } from "@/lib/data/api-tokens";
import { createClassSession, type SessionSnapshot } from "@/lib/data/class-sessions";
import { createScenario } from "@/lib/data/scenarios";
import { sessionSecret } from "@/lib/env";
import { freePort, root, waitForHttp } from "../../scripts/services";
import { addMember, makeUser, makeWorkspace, uniqueTag } from "../support/factories";

const firstUrl = inject("baseUrl");
let secondUrl = "";
let second: ChildProcess | undefined;

beforeAll(async () => {
  // Both servers read the session secret from the shared data folder; make sure it exists
  // before either needs it, so they do not each invent one.
  sessionSecret();
  const port = await freePort();
  secondUrl = `http://127.0.0.1:${port}`;
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: "production",
    NEXT_DIST_DIR: process.env.NEXT_DIST_DIR ?? ".next-test",
    APP_URL: secondUrl,
    LOXODROME_INSECURE_COOKIES: "1",
    LOXODROME_ALLOW_DEV_SECRET: "1",
    LOXODROME_DEV_TOOLS: "1",
  };
  const nextBin = path.join(root, "node_modules", "next", "dist", "bin", "next");
  second = spawn(process.execPath, [nextBin, "start", "-H", "127.0.0.1", "-p", String(port)], {
    cwd: root,
    env,
    stdio: ["ignore", "ignore", "inherit"],
  });
  await waitForHttp(`${secondUrl}/api/health`);
});

afterAll(async () => {
  if (second && second.exitCode === null) {
    const exited = new Promise((resolve) => second!.once("exit", resolve));
    second.kill("SIGTERM");
    await exited;
  }
});

async function openStream(url: string, headers: Record<string, string>) {
  const abort = new AbortController();
  const response = await fetch(url, { headers, signal: abort.signal });
  expect(response.status).toBe(200);
  expect(response.headers.get("content-type")).toMatch(/^text\/event-stream/);
  return { reader: new ServerSentEventReader(response.body!), abort };
}

const snapshotOf = (event: ServerSentEvent) => JSON.parse(event.data) as SessionSnapshot;

test("two servers, a viewer on each: the host acts on one, both viewers see the change", async () => {
  const host = await makeUser("host");
  const workspace = await makeWorkspace(host, "two-servers");
  const student = await makeUser("student");
  await addMember(workspace, student, "student");
  const scenario = await createScenario(workspace.id, host.id, {
    name: `Two servers ${uniqueTag()}`,
    description: "",
    answer: "Nothing is wrong.",
    spec: { ...DEFAULT_SCENARIO, pathSeconds: 60 },
  });
  const session = await createClassSession(workspace.id, host.id, { scenarioId: scenario.id, allowGuests: true, speed: 1 });
  const hostToken = (await createApiToken(host.id, "two servers")).token;
  const studentToken = (await createApiToken(student.id, "two servers")).token;

  // Viewer one: a student of the workspace, on the first server.
  const one = await openStream(`${firstUrl}/api/class-sessions/${session.id}/events`, { authorization: `Bearer ${studentToken}` });
  // Viewer two: a guest who joins with the code on the second server.
  const joined = await fetch(`${secondUrl}/api/join`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ code: session.joinCode, displayName: "Tui" }),
  });
  expect(joined.status).toBe(200);
  const cookie = joined.headers.get("set-cookie")!.split(";")[0];
  const two = await openStream(`${secondUrl}/api/class-sessions/${session.id}/events`, { cookie });

  const firstOne = snapshotOf(await one.reader.nextOf("snapshot"));
  const firstTwo = snapshotOf(await two.reader.nextOf("snapshot"));
  expect(firstOne.live.position).toBe(0);
  expect(firstTwo.stateVersion).toBeGreaterThanOrEqual(firstOne.stateVersion);

  const act = async (url: string, body: Record<string, unknown>) => {
    const response = await fetch(`${url}/api/class-sessions/${session.id}/control`, {
      method: "POST",
      headers: { authorization: `Bearer ${hostToken}`, "content-type": "application/json" },
      body: JSON.stringify(body),
    });
    expect(response.status).toBe(200);
    return ((await response.json()) as { snapshot: SessionSnapshot }).snapshot;
  };
  const reach = (version: number) => (event: ServerSentEvent) => snapshotOf(event).stateVersion >= version;

  // The host acts on the first server: both viewers get the new state.
  const stepped = await act(firstUrl, { action: "step", stepSeconds: 30 });
  const [a, b] = await Promise.all([
    one.reader.nextOf("snapshot", 15_000, reach(stepped.stateVersion)),
    two.reader.nextOf("snapshot", 15_000, reach(stepped.stateVersion)),
  ]);
  const rate = DEFAULT_SCENARIO.sampleRateHz;
  expect(snapshotOf(a).live.position).toBe(30 * rate);
  expect(snapshotOf(b).live.position).toBe(30 * rate);
  // The same (state version, position) gives the same live view on both servers.
  expect(a.id).toBe(b.id);
  expect(JSON.stringify(snapshotOf(a).live)).toBe(JSON.stringify(snapshotOf(b).live));

  // And the other way round: acting on the second server reaches the viewer on the first.
  const revealed = await act(secondUrl, { action: "reveal" });
  const [c, d] = await Promise.all([
    one.reader.nextOf("snapshot", 15_000, reach(revealed.stateVersion)),
    two.reader.nextOf("snapshot", 15_000, reach(revealed.stateVersion)),
  ]);
  expect(snapshotOf(c)).toMatchObject({ answerRevealed: true, answer: "Nothing is wrong." });
  expect(snapshotOf(d)).toMatchObject({ answerRevealed: true, answer: "Nothing is wrong." });

  // While it plays, each server ticks on its own and both viewers see the capture grow.
  const played = await act(firstUrl, { action: "play", speed: 1 });
  const moved = (event: ServerSentEvent) =>
    snapshotOf(event).stateVersion >= played.stateVersion && snapshotOf(event).live.position > 30 * rate;
  const [e, f] = await Promise.all([one.reader.nextOf("snapshot", 15_000, moved), two.reader.nextOf("snapshot", 15_000, moved)]);
  expect(snapshotOf(e).live.position).toBeGreaterThan(30 * rate);
  expect(snapshotOf(f).live.position).toBeGreaterThan(30 * rate);
  await act(secondUrl, { action: "end" });

  for (const stream of [one, two]) {
    stream.abort.abort();
    await stream.reader.cancel();
  }
});
