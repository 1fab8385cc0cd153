import { Readable } from "node:stream";
import { describe, expect, test } from "vitest";
import { magneticReference } from "@/geometry/magnetic-reference";
import { simulateCapture, tableToCsv } from "@/geometry/simulator";
import { UPLOAD_LIMITS } from "@/lib/fleet-terms";
import { IngestError } from "@/lib/ingest/csv-table";
import { CAPTURE_LIMITS, ingestCapture } from "@/lib/ingest/ingest-capture";

const streamOf = (text: string) => Readable.from([Buffer.from(text, "utf8")]);
// An invented site in the southern and western hemispheres; WMM2025 gives the simulator its field.
const site = { latitudeDeg: -41.3, longitudeDeg: -72.9, altitudeM: 40 };

describe("ingestCapture", () => {
  const { table } = simulateCapture({
    seed: 12,
    pathSeconds: 20,
    siteFieldNed: magneticReference(site, new Date("2026-04-10T12:00:00Z")).fieldNedMicrotesla,
    accelerometer: false,
    gyro: false,
  });
  const csv = tableToCsv(table);

  test("the capture date stands for noon UTC of that day", async () => {
    const { analysis, document } = await ingestCapture(streamOf(csv), {
      site,
      capturedOn: "2026-04-10",
      units: { magnetic: { kind: "magnetic", unit: "uT" } },
    });
    expect(analysis.date).toBe("2026-04-10T12:00:00.000Z");
    expect(document.date).toBe("2026-04-10T12:00:00.000Z");
    expect(document.site).toEqual(site);
  });

  test("without a date but with a site, today is used, at noon UTC", async () => {
    const { analysis } = await ingestCapture(streamOf(csv), { site });
    const today = new Date().toISOString().slice(0, 10);
    expect(analysis.date).toBe(`${today}T12:00:00.000Z`);
  });

  test("the limits are the upload's", async () => {
    expect(CAPTURE_LIMITS).toEqual({
      minRows: UPLOAD_LIMITS.minSamples,
      maxRows: UPLOAD_LIMITS.maxRows,
      maxColumns: UPLOAD_LIMITS.maxColumns,
    });
    const wide = ["time", "mag_x", "mag_y", "mag_z", ...Array.from({ length: UPLOAD_LIMITS.maxColumns }, (_, i) => `extra${i}`)];
    const row = wide.map(() => "1").join(",");
    const error = await ingestCapture(streamOf(`${wide.join(",")}\n${row}\n`)).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(IngestError);
    expect((error as IngestError).message).toMatch(new RegExp(`at most ${UPLOAD_LIMITS.maxColumns} are accepted`));
    const short = csv.split("\n").slice(0, UPLOAD_LIMITS.minSamples).join("\n");
    await expect(ingestCapture(streamOf(short))).rejects.toThrow(`at least ${UPLOAD_LIMITS.minSamples} are needed`);
  });

  test("units: stated beat the column name, which beats a guess", async () => {
    const named = csv.replace("compass_a.x,compass_a.y,compass_a.z", "magX_uT,magY_uT,magZ_uT");
    const fromName = await ingestCapture(streamOf(named));
    expect(fromName.analysis.units.compass_a).toMatchObject({ spec: { unit: "uT" }, how: "column name" });
    const stated = await ingestCapture(streamOf(named), { units: { magnetic: { kind: "magnetic", unit: "nT" } } });
    expect(stated.analysis.units.compass_a).toMatchObject({ spec: { unit: "nT" }, how: "stated" });
    const neither = await ingestCapture(streamOf(csv));
    expect(neither.analysis.units.compass_a.how).not.toMatch(/stated|column name/);
  });

  test("a file without a time column is read, and the note says how samples were spaced", async () => {
    const lines = csv.split("\n").map((line) => line.split(",").slice(1).join(","));
    const { analysis } = await ingestCapture(streamOf(lines.join("\n")));
    expect(analysis.notes.some((note) => /No time column/.test(note))).toBe(true);
  });

  test("the document has no accelerometer key without one, and tells how the file was read", async () => {
    const { document } = await ingestCapture(streamOf(csv.replace(/^time,/, "time,temperature,").replace(/\n(\d[^,]*),/g, "\n$1,21,")));
    expect(document).not.toHaveProperty("accelerometer");
    expect(document).not.toHaveProperty("powersMotors");
    expect((document.file as { ignoredColumns: string[] }).ignoredColumns).toEqual(["temperature"]);
    expect(document.notes).toContain("Columns not used: temperature.");
  });
});
