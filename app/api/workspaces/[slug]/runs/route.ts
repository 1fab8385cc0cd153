import { NextResponse } from "next/server";
import { readJson, readQuery, workspaceRoute } from "@/lib/api";
import { createRun, listRuns } from "@/lib/data/runs";
import { UPLOAD_LIMITS } from "@/lib/fleet-terms";
import { createRunSchema, runListQuerySchema } from "@/lib/validations/runs";

/**
 * Runs, filtered and paged on the server:
 * ?vehicleId=&sensorId=&verdict=pass|warn|fail&status=&uploaderId=&from=YYYY-MM-DD&to=&search=&sort=&order=&page=&pageSize=
 * Students see only runs shared with students.
 */
export const GET = workspaceRoute("run.view", async (request, { access }) => {
  const query = readQuery(request, runListQuerySchema);
  if (!query.ok) return query.response;
  const result = await listRuns(access.workspace.id, query.data, { sharedOnly: access.role === "student" });
  return NextResponse.json({ ...result, page: query.data.page, pageSize: query.data.pageSize });
});

/**
 * Register a run. The answer carries a presigned URL: PUT the file there (straight to object
 * storage), then POST …/runs/{id}/uploaded to queue the processing. With {columns} (the file's
 * header names) the server tells a motor run from its current or throttle column and refuses it
 * without {safetyAcknowledged: true} (400, naming the field and the column).
 */
export const POST = workspaceRoute("run.create", async (request, { access, viewer }) => {
  const body = await readJson(request, createRunSchema);
  if (!body.ok) return body.response;
  const { run, uploadUrl } = await createRun(access.workspace.id, viewer.id, body.data);
  return NextResponse.json(
    { run, upload: { url: uploadUrl, method: "PUT", headers: { "content-type": "text/csv" }, maxBytes: UPLOAD_LIMITS.maxBytes } },
    { status: 201 },
  );
});
