import path from "node:path";
import { simulateCapture, tableToCsv } from "@/geometry/simulator";
import type { CaptureSpec } from "@/geometry/magnetometer-types";
import { magneticReference } from "@/geometry/magnetic-reference";
import type { WorkspaceSummary } from "@/lib/data/workspaces";

type Handler = (request: Request, context: { params: Promise<Record<string, string>> }) => Promise<Response>;

/** Call a route handler module the way Next would, returning status and parsed JSON. */
export async function callRoute(
  file: string,
  method: string,
  params: Record<string, string>,
  body?: unknown,
  query = "",
): Promise<{ status: number; json: Record<string, unknown>; response: Response }> {
  const mod = (await import(/* @vite-ignore */ path.resolve(file))) as Record<string, Handler>;
  const handler = mod[method];
  if (!handler) throw new Error(`${file} has no ${method}`);
  const request = new Request(`http://test.local/api${query}`, {
    method,
    headers: { "content-type": "application/json" },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const response = await handler(request, { params: Promise.resolve(params) });
  const text = response.status === 302 ? "{}" : await response.text();
  return { status: response.status, json: text ? JSON.parse(text) : {}, response };
}

export const WS = "app/api/workspaces/[slug]";

/** A site of our choosing (an invented name at real coordinates) and its WMM2025 field, µT in NED. */
export const TEST_SITE = { name: "Harbour wall field", latitudeDeg: 47.2, longitudeDeg: 8.6, altitudeM: 420 };
export function siteFieldNed(date = new Date("2026-06-01T12:00:00Z")): [number, number, number] {
  return magneticReference(TEST_SITE, date).fieldNedMicrotesla;
}

export function simulatedCsv(spec: CaptureSpec): string {
  return tableToCsv(simulateCapture(spec).table);
}

/** Register a run, PUT the file to its presigned URL and mark it uploaded. Returns the run id and its first version. */
export async function uploadRun(
  workspace: WorkspaceSummary,
  input: {
    vehicleId: string;
    siteId?: string | null;
    sensorSlots?: Record<string, string>;
    csv: string;
    fileName?: string;
    model?: string;
    capturedOn?: string;
  },
): Promise<{ runId: string; status: number; json: Record<string, unknown> }> {
  const created = await callRoute(
    `${WS}/runs/route.ts`,
    "POST",
    { slug: workspace.slug },
    {
      vehicleId: input.vehicleId,
      siteId: input.siteId ?? null,
      capturedOn: input.capturedOn ?? "2026-06-01",
      fileName: input.fileName ?? "capture.csv",
      fileSize: Buffer.byteLength(input.csv),
      sensorSlots: input.sensorSlots ?? {},
      model: input.model ?? "auto",
    },
  );
  if (created.status !== 201) return { runId: "", status: created.status, json: created.json };
  const { run, upload } = created.json as { run: { id: string }; upload: { url: string } };
  const put = await fetch(upload.url, { method: "PUT", body: input.csv, headers: { "content-type": "text/csv" } });
  if (!put.ok) throw new Error(`upload PUT failed: ${put.status}`);
  const marked = await callRoute(`${WS}/runs/[runId]/uploaded/route.ts`, "POST", { slug: workspace.slug, runId: run.id });
  return { runId: run.id, status: marked.status, json: marked.json };
}
