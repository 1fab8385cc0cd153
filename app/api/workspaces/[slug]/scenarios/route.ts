import { NextResponse } from "next/server";
import { readJson, workspaceRoute } from "@/lib/api";
import { createScenario, listScenarios } from "@/lib/data/scenarios";
import { scenarioSchema } from "@/lib/validations/classroom";

/** The workspace's teaching scenarios, ready-made ones first. */
export const GET = workspaceRoute("scenario.manage", async (_request, { access }) =>
  NextResponse.json({ scenarios: await listScenarios(access.workspace.id) }),
);

/** Save a scenario: a name, a description, the simulated sensor's spec and the answer (the fault, in words). */
export const POST = workspaceRoute("scenario.manage", async (request, { access, viewer }) => {
  const body = await readJson(request, scenarioSchema);
  if (!body.ok) return body.response;
  return NextResponse.json({ scenario: await createScenario(access.workspace.id, viewer.id, body.data) }, { status: 201 });
});
