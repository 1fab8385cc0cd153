/**
 * End-to-end benchmark of the product's main flow: register a run, PUT the CSV to object
 * storage by its presigned URL, mark it uploaded, and wait until the worker (a separate
 * process, as in production) has streamed, parsed, fitted, checked and saved it — for 10k,
 * 100k and 1M rows. Prints seconds from upload to done and the worker's peak resident memory
 * (VmHWM from /proc), which must stay bounded as the file grows.
 *
 * Runs against the project's own PostgreSQL (a throwaway database) and the object-storage
 * fake; run alone with `npx tsx --conditions=react-server bench/e2e-bench.ts`.
 */
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { simulateCapture } from "@/geometry/simulator";
import { dropDatabase, ensureDatabase, ensureObjectStorage, migrate, spawnWorker } from "../scripts/services";

const SIZES = [10_000, 100_000, 1_000_000];

/** A simulated 100 Hz capture (two compasses, accelerometer, gyro) tiled to `rows` rows. */
function tiledCsv(rows: number): string {
  const base = simulateCapture({
    seed: 2,
    sampleRateHz: 100,
    pathSeconds: 60,
    magnetometers: [{ hardIronOffset: [12, -5, 20], softIron: "mild" }, {}],
  }).table;
  const span = base.columns.time[base.length - 1] + 0.01;
  const columns: Record<string, Float64Array> = {};
  for (const field of base.fields) {
    const source = base.columns[field];
    const target = new Float64Array(rows);
    for (let i = 0; i < rows; i++)
      target[i] = field === "time" ? source[i % base.length] + Math.floor(i / base.length) * span : source[i % base.length];
    columns[field] = target;
  }
  // Three decimals, as a logger writes them (µT, m/s², rad/s, s): about 100 MiB for 1M rows.
  const lines = [base.fields.join(",")];
  for (let i = 0; i < rows; i++) lines.push(base.fields.map((f) => columns[f][i].toFixed(3)).join(","));
  return lines.join("\n") + "\n";
}

function peakRssMiB(pid: number): number {
  const status = fs.readFileSync(`/proc/${pid}/status`, "utf8");
  const kb = Number(/VmHWM:\s+(\d+)/.exec(status)?.[1] ?? 0);
  return kb / 1024;
}

export async function benchEndToEnd(): Promise<void> {
  const database = `loxodrome_bench_${process.pid}`;
  const tmp = fs.mkdtempSync(path.join(os.tmpdir(), "loxodrome-bench-"));
  ensureDatabase();
  process.env.DATABASE_URL = ensureDatabase(database);
  process.env.LOXODROME_DATA_DIR = tmp;
  const storage = await ensureObjectStorage(path.join(tmp, "s3"));
  await migrate();
  const { db, closeDb } = await import("@/lib/db");
  const { createUser } = await import("@/lib/data/users");
  const { createWorkspace } = await import("@/lib/data/workspaces");
  const { createVehicle } = await import("@/lib/data/vehicles");
  const { createRun, markUploaded } = await import("@/lib/data/runs");
  const { stopQueue } = await import("@/lib/jobs/queue");

  const worker = spawnWorker(process.env, ["ignore", "ignore", "inherit"]);
  try {
    const user = await createUser({ name: "Bench", email: `bench-${process.pid}@bench.example`, password: "bench-password-1" });
    const workspace = await createWorkspace(user.id, { name: "Bench", slug: `bench-${process.pid}`, kind: "other" });
    const vehicle = await createVehicle(workspace.id, user.id, {
      name: "Bench rig",
      kind: "other",
      airframe: "",
      serialTag: "",
      customer: "",
      notes: "",
    });
    console.log("\nEnd to end: upload → done (worker process; PostgreSQL queue; object-storage fake)");
    console.log("rows        file MiB   upload s   processing s   total s   rows/s      worker peak RSS MiB");
    for (const rows of SIZES) {
      const csv = tiledCsv(rows);
      const bytes = Buffer.byteLength(csv);
      const started = performance.now();
      const { run, uploadUrl } = await createRun(workspace.id, user.id, {
        vehicleId: vehicle.id,
        capturedOn: "2026-06-01",
        title: `${rows} rows`,
        fileName: `bench-${rows}.csv`,
        fileSize: bytes,
        columnMapping: {},
        units: { magnetic: "uT", acceleration: "m/s2", rate: "rad/s", time: "s" },
        sensorSlots: {},
        model: "auto",
        powersMotors: false,
      });
      const put = await fetch(uploadUrl, { method: "PUT", body: csv, headers: { "content-type": "text/csv" } });
      if (!put.ok) throw new Error(`upload failed: ${put.status}`);
      await markUploaded(workspace.id, user.id, run.id);
      const uploaded = performance.now();
      for (;;) {
        const row = await db().models.Run.findByPk(run.id, { attributes: ["status", "error"] });
        if (row!.status === "done") break;
        if (row!.status === "failed") throw new Error(`run failed: ${JSON.stringify(row!.error)}`);
        await new Promise((r) => setTimeout(r, 100));
      }
      const finished = performance.now();
      const total = (finished - started) / 1000;
      console.log(
        `${String(rows).padEnd(11)} ${(bytes / 1048576).toFixed(1).padStart(8)}   ${((uploaded - started) / 1000).toFixed(2).padStart(8)}   ${((finished - uploaded) / 1000).toFixed(2).padStart(12)}   ${total.toFixed(2).padStart(7)}   ${Math.round(
          rows / total,
        )
          .toString()
          .padStart(9)}   ${peakRssMiB(worker.pid!).toFixed(0).padStart(8)}`,
      );
    }
    console.log("Goal: 1,000,000 rows from upload to result in ≤ 2.0 s (total).");
  } finally {
    worker.kill("SIGTERM");
    await stopQueue();
    await closeDb();
    await storage?.close();
    dropDatabase(database);
    fs.rmSync(tmp, { recursive: true, force: true });
  }
}

if (process.argv[1] && path.resolve(process.argv[1]) === path.resolve(__filename)) {
  benchEndToEnd().catch((error) => {
    console.error(error);
    process.exit(1);
  });
}
