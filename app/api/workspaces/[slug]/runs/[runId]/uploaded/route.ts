import { NextResponse } from "next/server";
import { forbidden, notFound, readJson, workspaceRoute } from "@/lib/api";
import { runAccess } from "@/lib/data/run-access";
import { markUploaded } from "@/lib/data/runs";
import { markUploadedSchema } from "@/lib/validations/runs";

/**
 * The file is in storage: check it and queue the processing. The stored file's header decides
 * whether the capture powered motors; if it did and the cautions were never confirmed, the call
 * is refused (400, `fields.safetyAcknowledged`) until it is repeated with
 * `{ "safetyAcknowledged": true }`. The body is optional otherwise.
 */
export const POST = workspaceRoute<{ slug: string; runId: string }>("run.create", async (request, context, { runId }) => {
  const access = await runAccess(context, runId, "run.edit");
  if (access === "missing") return notFound();
  if (access === "forbidden") return forbidden();
  let options = { safetyAcknowledged: false };
  if ((await request.clone().text()).trim() !== "") {
    const body = await readJson(request, markUploadedSchema);
    if (!body.ok) return body.response;
    options = body.data;
  }
  return NextResponse.json({ run: await markUploaded(context.access.workspace.id, context.viewer.id, runId, options) }, { status: 202 });
});
