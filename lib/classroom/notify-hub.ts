import "server-only";
import pg from "pg";
import { db } from "@/lib/db";
import { databaseUrl } from "@/lib/env";

/**
 * Fan-out between app processes through PostgreSQL: every change to a class session is written
 * to the database first, then announced with `NOTIFY class_session, '<sessionId>'`. Each process
 * holds one dedicated connection that LISTENs on that channel and tells the local subscribers
 * of that session, who re-read the state from the database. Nothing is shared through one
 * process's memory, so viewers on different processes behind one address see the same state.
 *
 * The connection is opened on the first subscription and reopened when it drops (with a
 * growing pause, up to 5 s); after a reconnect every subscriber is told to re-read, since
 * notifications sent while it was down are lost.
 */
export const CLASS_CHANNEL = "class_session";

type Listener = (sessionId: string) => void;

class NotifyHub {
  private client: pg.Client | null = null;
  private connecting: Promise<void> | null = null;
  private retryTimer: NodeJS.Timeout | null = null;
  private retryDelayMs = 250;
  private stopped = false;
  private everConnected = false;
  private readonly listeners = new Map<string, Set<Listener>>();
  /** How many times the connection has been (re)opened; tests watch it. */
  connections = 0;

  /** Listen for changes to one session; resolves once the channel is being listened to. */
  async subscribe(sessionId: string, listener: Listener): Promise<() => void> {
    this.stopped = false;
    let set = this.listeners.get(sessionId);
    if (!set) this.listeners.set(sessionId, (set = new Set()));
    set.add(listener);
    const unsubscribe = () => {
      const current = this.listeners.get(sessionId);
      current?.delete(listener);
      if (current && current.size === 0) this.listeners.delete(sessionId);
    };
    try {
      await this.ensureConnected();
    } catch (error) {
      // The reconnect loop keeps trying; the subscriber is told to re-read once it succeeds.
      console.error("[class hub] could not listen yet:", (error as Error).message);
    }
    return unsubscribe;
  }

  /** The backend pid of the listening connection (tests end it to prove reconnection). */
  listenerPid(): number | null {
    return (this.client as unknown as { processID?: number } | null)?.processID ?? null;
  }

  private ensureConnected(): Promise<void> {
    if (this.client) return Promise.resolve();
    this.connecting ??= this.connect().finally(() => {
      this.connecting = null;
    });
    return this.connecting;
  }

  private async connect(): Promise<void> {
    const client = new pg.Client({ connectionString: databaseUrl, application_name: "loxodrome-class-hub" });
    client.on("notification", (message) => {
      if (message.channel === CLASS_CHANNEL && message.payload) this.dispatch(message.payload);
    });
    client.on("error", (error) => this.dropped(client, error));
    client.on("end", () => this.dropped(client));
    try {
      await client.connect();
      await client.query(`LISTEN ${CLASS_CHANNEL}`);
    } catch (error) {
      client.removeAllListeners();
      client.end().catch(() => undefined);
      this.scheduleReconnect();
      throw error;
    }
    if (this.stopped) {
      await client.end().catch(() => undefined);
      return;
    }
    this.client = client;
    this.connections += 1;
    this.retryDelayMs = 250;
    if (this.everConnected) for (const sessionId of [...this.listeners.keys()]) this.dispatch(sessionId);
    this.everConnected = true;
  }

  private dropped(client: pg.Client, error?: Error): void {
    if (this.client !== client) return;
    this.client = null;
    client.removeAllListeners();
    client.on("error", () => undefined);
    client.end().catch(() => undefined);
    if (this.stopped) return;
    if (error) console.error("[class hub] connection lost:", error.message);
    this.scheduleReconnect();
  }

  private scheduleReconnect(): void {
    if (this.stopped || this.retryTimer) return;
    const delay = this.retryDelayMs;
    this.retryDelayMs = Math.min(5000, this.retryDelayMs * 2);
    this.retryTimer = setTimeout(() => {
      this.retryTimer = null;
      if (this.stopped || this.client) return;
      this.ensureConnected().catch(() => undefined);
    }, delay);
    this.retryTimer.unref?.();
  }

  private dispatch(sessionId: string): void {
    for (const listener of [...(this.listeners.get(sessionId) ?? [])]) {
      try {
        listener(sessionId);
      } catch (error) {
        console.error("[class hub] listener failed:", error);
      }
    }
  }

  async stop(): Promise<void> {
    this.stopped = true;
    if (this.retryTimer) clearTimeout(this.retryTimer);
    this.retryTimer = null;
    await this.connecting?.catch(() => undefined);
    const client = this.client;
    this.client = null;
    this.everConnected = false;
    if (client) {
      client.removeAllListeners();
      client.on("error", () => undefined);
      await client.end().catch(() => undefined);
    }
  }
}

const g = globalThis as unknown as { loxodromeClassHub?: NotifyHub };

/** The process's one hub (kept on globalThis so dev reloads and route bundles share it). */
export function classHub(): NotifyHub {
  g.loxodromeClassHub ??= new NotifyHub();
  return g.loxodromeClassHub;
}

/** Close the listening connection (tests and scripts, so the process can exit). */
export async function stopClassHub(): Promise<void> {
  await g.loxodromeClassHub?.stop();
}

/** Tell every process that a session changed. Call after the change is committed. */
export async function notifySession(sessionId: string): Promise<void> {
  await db().sequelize.query(`SELECT pg_notify('${CLASS_CHANNEL}', :sessionId)`, { replacements: { sessionId } });
}
