import { NextResponse } from "next/server";
import { notFound, readJson, workspaceRoute } from "@/lib/api";
import { deleteScenario, getScenario, updateScenario } from "@/lib/data/scenarios";
import { scenarioUpdateSchema } from "@/lib/validations/classroom";

type P = { slug: string; scenarioId: string };

export const GET = workspaceRoute<P>("scenario.manage", async (_request, { access }, { scenarioId }) => {
  const scenario = await getScenario(access.workspace.id, scenarioId);
  return scenario ? NextResponse.json({ scenario }) : notFound();
});

/** Change any of name, description, spec, answer; sessions already started keep their copy. */
export const PATCH = workspaceRoute<P>("scenario.manage", async (request, { access, viewer }, { scenarioId }) => {
  const body = await readJson(request, scenarioUpdateSchema);
  if (!body.ok) return body.response;
  const scenario = await updateScenario(access.workspace.id, viewer.id, scenarioId, body.data);
  return scenario ? NextResponse.json({ scenario }) : notFound();
});

export const DELETE = workspaceRoute<P>("scenario.manage", async (_request, { access, viewer }, { scenarioId }) =>
  (await deleteScenario(access.workspace.id, viewer.id, scenarioId)) ? NextResponse.json({ deleted: true }) : notFound(),
);
