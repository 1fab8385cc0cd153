import { NextResponse } from "next/server";
import { notFound, workspaceRoute } from "@/lib/api";
import { duplicateScenario } from "@/lib/data/scenarios";

type P = { slug: string; scenarioId: string };

/** A copy named "… (copy)", to change without touching the original. */
export const POST = workspaceRoute<P>("scenario.manage", async (_request, { access, viewer }, { scenarioId }) => {
  const scenario = await duplicateScenario(access.workspace.id, viewer.id, scenarioId);
  return scenario ? NextResponse.json({ scenario }, { status: 201 }) : notFound();
});
