import { PROCESS_RUN_VERSION, JOB_SETTINGS, queue } from "@/lib/jobs/queue";
import { giveUp, processRunVersion, type ProcessHooks } from "@/lib/jobs/process-run-version";

/**
 * Take run versions off the queue one at a time and process them. A thrown error lets
 * pg-boss retry the job (after JOB_SETTINGS.retryDelay seconds, up to retryLimit times);
 * on the last attempt the version is marked failed so no run waits forever.
 */
export async function startWorker(log: (line: string) => void = console.log, hooks: ProcessHooks = {}): Promise<() => Promise<void>> {
  const boss = await queue();
  await boss.work<{ versionId: string }>(
    PROCESS_RUN_VERSION,
    { batchSize: 1, pollingIntervalSeconds: 0.5, includeMetadata: true },
    async ([job]) => {
      const started = Date.now();
      let stages = "";
      const timings = (t: { read: number; fit: number; save: number; record: number }) => {
        stages = ` (read ${t.read.toFixed(2)} s, fit ${t.fit.toFixed(2)} s, save ${t.save.toFixed(2)} s, record ${t.record.toFixed(2)} s)`;
        hooks.timings?.(t);
      };
      try {
        const outcome = await processRunVersion(job.data.versionId, { ...hooks, timings });
        log(`[worker] version ${job.data.versionId}: ${outcome} in ${Date.now() - started} ms${stages}`);
      } catch (error) {
        log(`[worker] version ${job.data.versionId}: attempt ${job.retryCount + 1} failed: ${(error as Error).message}`);
        if (job.retryCount >= JOB_SETTINGS.retryLimit) await giveUp(job.data.versionId, (error as Error).message);
        throw error;
      }
    },
  );
  return async () => {
    await boss.offWork(PROCESS_RUN_VERSION);
  };
}
