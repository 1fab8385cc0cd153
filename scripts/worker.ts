/**
 * The background worker: processes uploaded runs from the PostgreSQL job queue. Started by
 * `npm start`, `npm run dev` and the browser tests beside the web server; several may run.
 */
async function main() {
  const { startWorker } = await import("@/lib/jobs/worker");
  const { stopQueue } = await import("@/lib/jobs/queue");
  const { closeDb } = await import("@/lib/db");
  // Test seam for the crash-and-retry test: die abruptly in the middle of one given version's
  // job, as a killed process would.
  const crashVersion = process.env.LOXODROME_TEST_CRASH_VERSION;
  await startWorker(
    console.log,
    crashVersion ? { afterParse: (versionId) => (versionId === crashVersion ? process.exit(137) : undefined) } : {},
  );
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
