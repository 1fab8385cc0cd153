import "server-only";
import { classHub } from "@/lib/classroom/notify-hub";
import { classroomNow, nextTickAt } from "@/lib/classroom/playback-clock";
import { answersOf, getTally } from "@/lib/classroom/questions";
import type { SessionAccess } from "@/lib/classroom/session-guard";
import { runPathFor, snapshotEventId, snapshotJson } from "@/lib/classroom/session-snapshot";
import { endSession, loadSession, positionOf, type LoadedSession } from "@/lib/data/class-sessions";

/**
 * The live engine of one process: for each session that some of this process's viewers watch,
 * one watcher that
 *  - re-reads the session from the database whenever PostgreSQL announces a change to it
 *    (lib/classroom/notify-hub.ts), coalescing bursts into one read;
 *  - while it plays, wakes on each tick boundary of the playback rule;
 *  - sends each viewer a snapshot only when what that viewer sees changed — (stateVersion,
 *    position) and the question for everyone, plus the participant count for the host — and
 *    the host a tally when questions or answers change.
 * Frames are built once per distinct content and handed to every viewer who needs them.
 */

export interface ViewerSink {
  /** A complete SSE frame; `kind` lets a slow connection keep only the newest of each kind. */
  send(frame: Uint8Array, kind: "snapshot" | "tally"): void;
  /** The session is gone: end the stream. */
  close(): void;
}

interface Viewer {
  access: SessionAccess;
  sink: ViewerSink;
  /** What the last snapshot sent to this viewer showed. */
  sentKey: string | null;
  sentTallyKey: string | null;
}

const encoder = new TextEncoder();

/** One Server-Sent Events frame. JSON text has no raw newlines, so one data line holds it. */
export function sseFrame(event: string, data: string, id?: string): Uint8Array {
  return encoder.encode(`${id === undefined ? "" : `id: ${id}\n`}event: ${event}\ndata: ${data}\n\n`);
}

class SessionWatch {
  readonly viewers = new Set<Viewer>();
  private session: LoadedSession | null = null;
  /** Answers of local participants to the current question, valid for `choicesKey`. */
  private choices = new Map<string, number>();
  private choicesKey = "";
  private frames = new Map<string, Uint8Array>();
  private tally: { key: string; frame: Uint8Array } | null = null;
  private tickTimer: NodeJS.Timeout | null = null;
  private expiryTimer: NodeJS.Timeout | null = null;
  private unsubscribe: (() => void) | null = null;
  private reloading: Promise<void> | null = null;
  private dirty = false;
  private stopped = false;
  readonly ready: Promise<void>;

  constructor(readonly sessionId: string) {
    this.ready = this.start();
  }

  private async start(): Promise<void> {
    this.unsubscribe = await classHub().subscribe(this.sessionId, () => this.requestReload());
    await this.requestReload();
  }

  /** Re-read the session; a notification arriving meanwhile causes one more read, not one each. */
  requestReload(): Promise<void> {
    if (this.reloading) {
      this.dirty = true;
      return this.reloading;
    }
    this.reloading = (async () => {
      do {
        this.dirty = false;
        try {
          await this.reload();
        } catch (error) {
          console.error(`[classroom] could not refresh session ${this.sessionId}:`, error);
        }
      } while (this.dirty && !this.stopped);
    })().finally(() => {
      this.reloading = null;
    });
    return this.reloading;
  }

  private async reload(): Promise<void> {
    const session = await loadSession(this.sessionId);
    if (this.stopped) return;
    if (!session) {
      for (const viewer of this.viewers) viewer.sink.close();
      return;
    }
    this.session = session;
    this.frames.clear();
    await this.refreshChoices(false);
    await this.refreshTally();
    this.push();
    this.schedule();
  }

  /** Local participants' answers to the current question, re-read when answers or the question change. */
  private async refreshChoices(force: boolean): Promise<void> {
    const session = this.session;
    if (!session?.question) {
      this.choices = new Map();
      this.choicesKey = "";
      return;
    }
    const key = `${session.question.id}.${session.answersVersion}`;
    if (!force && key === this.choicesKey) return;
    const ids = [...this.viewers].map((v) => v.access.participantId).filter((id): id is string => id !== null);
    this.choices = await answersOf(session.question.id, ids);
    this.choicesKey = key;
  }

  private async refreshTally(): Promise<void> {
    const session = this.session;
    if (!session || ![...this.viewers].some((v) => v.access.role === "host")) return;
    const key = `${session.questionsVersion}.${session.answersVersion}`;
    if (this.tally?.key === key) return;
    this.tally = { key, frame: sseFrame("tally", JSON.stringify(await getTally(this.sessionId))) };
  }

  /** Send every viewer whose view changed its new snapshot (and hosts the tally). */
  push(only?: Viewer): void {
    const session = this.session;
    if (!session) return;
    const position = positionOf(session);
    const base = snapshotEventId(session, position);
    for (const viewer of only ? [only] : this.viewers) {
      const host = viewer.access.role === "host";
      const myChoice = viewer.access.participantId ? (this.choices.get(viewer.access.participantId) ?? null) : null;
      const runPath = runPathFor(session, viewer.access.memberRole, viewer.access.user?.id ?? null);
      // A participant's view does not change with each newcomer; the host's count does.
      const sentKey = `${base}|${viewer.access.role}|${myChoice}|${runPath}|${host ? session.participants : ""}`;
      if (viewer.sentKey !== sentKey) {
        const frameKey = `${sentKey}|${session.participants}`;
        let frame = this.frames.get(frameKey);
        if (!frame) {
          frame = sseFrame("snapshot", snapshotJson(session, position, { role: viewer.access.role, myChoice, runPath }), base);
          this.frames.set(frameKey, frame);
        }
        viewer.sink.send(frame, "snapshot");
        viewer.sentKey = sentKey;
      }
      if (host && this.tally && viewer.sentTallyKey !== this.tally.key) {
        viewer.sink.send(this.tally.frame, "tally");
        viewer.sentTallyKey = this.tally.key;
      }
    }
  }

  /** Wake at the next tick boundary while playing, and when the join code expires. */
  private schedule(): void {
    if (this.tickTimer) clearTimeout(this.tickTimer);
    if (this.expiryTimer) clearTimeout(this.expiryTimer);
    this.tickTimer = this.expiryTimer = null;
    const session = this.session;
    if (!session || this.stopped || session.status === "ended") return;
    const now = classroomNow();
    const next = nextTickAt(session.playback, session.totalSamples, session.sampleRateHz, now);
    if (next !== null) {
      // A few ms past the boundary, so floor() has surely moved on.
      this.tickTimer = setTimeout(
        () => {
          this.frames.clear();
          this.push();
          this.schedule();
        },
        Math.max(0, next - now) + 3,
      );
    }
    const untilExpiry = session.expiresAtMs - now;
    if (untilExpiry < 2 ** 31 - 1) {
      this.expiryTimer = setTimeout(
        () => {
          endSession(this.sessionId, null, "expired").catch((error) => console.error("[classroom] expiry failed:", error));
        },
        Math.max(0, untilExpiry) + 10,
      );
    }
  }

  async add(viewer: Viewer): Promise<void> {
    this.viewers.add(viewer);
    await this.ready;
    if (this.reloading) await this.reloading;
    const session = this.session;
    if (viewer.access.participantId && session?.question) {
      const own = await answersOf(session.question.id, [viewer.access.participantId]);
      const choice = own.get(viewer.access.participantId);
      if (choice !== undefined) this.choices.set(viewer.access.participantId, choice);
    }
    if (viewer.access.role === "host") await this.refreshTally();
    // A new connection always starts with the full current snapshot.
    this.push(viewer);
  }

  remove(viewer: Viewer): boolean {
    this.viewers.delete(viewer);
    return this.viewers.size === 0;
  }

  stop(): void {
    this.stopped = true;
    if (this.tickTimer) clearTimeout(this.tickTimer);
    if (this.expiryTimer) clearTimeout(this.expiryTimer);
    this.unsubscribe?.();
  }
}

const g = globalThis as unknown as { loxodromeSessionWatches?: Map<string, SessionWatch> };

function watches(): Map<string, SessionWatch> {
  g.loxodromeSessionWatches ??= new Map();
  return g.loxodromeSessionWatches;
}

/**
 * Start sending one viewer the live state of a session: first the full current snapshot (and
 * the tally for the host), then every change. Call the returned function when the viewer leaves.
 */
export async function watchSession(access: SessionAccess, sink: ViewerSink): Promise<() => void> {
  const all = watches();
  let watch = all.get(access.sessionId);
  if (!watch) {
    watch = new SessionWatch(access.sessionId);
    all.set(access.sessionId, watch);
  }
  const viewer: Viewer = { access, sink, sentKey: null, sentTallyKey: null };
  const current = watch;
  let left = false;
  const leave = () => {
    if (left) return;
    left = true;
    if (current.remove(viewer) && all.get(access.sessionId) === current) {
      current.stop();
      all.delete(access.sessionId);
    }
  };
  try {
    await current.add(viewer);
  } catch (error) {
    leave();
    throw error;
  }
  return leave;
}

/** How many sessions and viewers this process is serving (tests and the bench). */
export function liveChannelStats(): { sessions: number; viewers: number } {
  let viewers = 0;
  for (const watch of watches().values()) viewers += watch.viewers.size;
  return { sessions: watches().size, viewers };
}

/** Stop every watcher (tests, shutdown). */
export function stopLiveChannels(): void {
  for (const watch of watches().values()) watch.stop();
  watches().clear();
}
