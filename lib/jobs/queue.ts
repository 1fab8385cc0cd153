import PgBoss from "pg-boss";
import { databaseUrl } from "@/lib/env";

/**
 * The job queue, kept in PostgreSQL by pg-boss (its own `pgboss` schema). The web server only
 * sends jobs; the worker process (scripts/worker.ts) does them, so a long fit never stalls a
 * page. A job whose worker dies is expired and retried by pg-boss's supervisor.
 */
export const PROCESS_RUN_VERSION = "process-run-version";

export const JOB_SETTINGS = {
  retryLimit: Number(process.env.JOB_RETRY_LIMIT ?? 3),
  retryDelay: Number(process.env.JOB_RETRY_DELAY_S ?? 2),
  expireInSeconds: Number(process.env.JOB_EXPIRE_S ?? 900),
};

const g = globalThis as unknown as { loxodromeQueue?: Promise<PgBoss> };

async function startQueue(): Promise<PgBoss> {
  const boss = new PgBoss({
    connectionString: databaseUrl,
    max: 4,
    application_name: "loxodrome-queue",
    // Find jobs whose worker died quickly enough that a retry follows within seconds.
    maintenanceIntervalSeconds: Number(process.env.JOB_MAINTENANCE_S ?? 30),
  });
  boss.on("error", (error) => console.error("[queue]", error));
  await boss.start();
  await boss.createQueue(PROCESS_RUN_VERSION, { name: PROCESS_RUN_VERSION, ...JOB_SETTINGS });
  return boss;
}

export function queue(): Promise<PgBoss> {
  g.loxodromeQueue ??= startQueue().catch((error) => {
    g.loxodromeQueue = undefined;
    throw error;
  });
  return g.loxodromeQueue;
}

/** Ask the worker to process one run version; a version is only ever queued once at a time. */
export async function enqueueVersion(versionId: string): Promise<void> {
  await (await queue()).send(PROCESS_RUN_VERSION, { versionId }, { singletonKey: versionId, ...JOB_SETTINGS });
}

export async function stopQueue(): Promise<void> {
  const current = g.loxodromeQueue;
  g.loxodromeQueue = undefined;
  if (current) await (await current).stop({ graceful: false, wait: true });
}
