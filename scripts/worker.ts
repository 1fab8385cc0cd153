/**
 * The background worker: processes uploaded runs from the PostgreSQL job queue. Started by
 * `npm start`, `npm run dev` and the browser tests beside the web server; several may run.
 */
async function main() {
  const { startWorker } = await import("@/lib/jobs/worker");
  const { stopQueue } = await import("@/lib/jobs/queue");
  const { closeDb } = await import("@/lib/db");
  // Test seam for the crash-and-retry test: die abruptly in the middle of a job, as a killed process would.
  const crash = process.env.LOXODROME_TEST_CRASH_AFTER_PARSE === "1";
  await startWorker(console.log, crash ? { afterParse: () => process.exit(137) } : {});
  console.log("[worker] waiting for runs to process");
  const stop = async () => {
    await stopQueue();
    await closeDb();
    process.exit(0);
  };
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
}

main().catch((error) => {
  console.error("[worker] failed to start:", error);
  process.exit(1);
});
