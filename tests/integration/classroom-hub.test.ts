/**
 * The fan-out channel between app processes: PostgreSQL LISTEN/NOTIFY on one dedicated
 * connection per process, which comes back on its own when the database drops it.
 */
import crypto from "node:crypto";
import { afterAll, describe, expect, test } from "vitest";
import { classHub, notifySession, stopClassHub } from "@/lib/classroom/notify-hub";
import { closeDb, db } from "@/lib/db";

afterAll(async () => {
  await stopClassHub();
  await closeDb();
});

/** Resolve when `predicate` holds, polling every 20 ms; fail after `timeoutMs`. */
async function eventually(predicate: () => boolean, timeoutMs = 10_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!predicate()) {
    if (Date.now() > deadline) throw new Error("condition not met in time");
    await new Promise((r) => setTimeout(r, 20));
  }
}

describe("classHub", () => {
  test("a notification reaches the subscribers of that session only", async () => {
    const [a, b] = [crypto.randomUUID(), crypto.randomUUID()];
    const heard: string[] = [];
    const offA = await classHub().subscribe(a, (id) => heard.push(`a:${id}`));
    const offB = await classHub().subscribe(b, (id) => heard.push(`b:${id}`));
    await notifySession(a);
    await eventually(() => heard.length >= 1);
    await new Promise((r) => setTimeout(r, 100));
    expect(heard).toEqual([`a:${a}`]);
    offA();
    await notifySession(a);
    await notifySession(b);
    await eventually(() => heard.includes(`b:${b}`));
    expect(heard.filter((h) => h.startsWith("a:"))).toHaveLength(1);
    offB();
  });

  test("when the database drops the listening connection, the hub reconnects, tells subscribers to re-read, and hears later changes", async () => {
    const session = crypto.randomUUID();
    const heard: number[] = [];
    const off = await classHub().subscribe(session, () => heard.push(Date.now()));
    const pid = classHub().listenerPid();
    expect(pid).not.toBeNull();
    const before = classHub().connections;
    await db().sequelize.query("SELECT pg_terminate_backend(:pid)", { replacements: { pid } });
    // Changes made while it was down are not lost: the reconnect itself asks for a re-read.
    await eventually(() => classHub().connections > before && heard.length >= 1);
    expect(classHub().listenerPid()).not.toBe(pid);
    const afterResync = heard.length;
    await notifySession(session);
    await eventually(() => heard.length > afterResync);
    off();
  });
});
