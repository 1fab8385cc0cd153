import { NextResponse } from "next/server";
import { notFound, readJson, workspaceRoute } from "@/lib/api";
import { updateSite } from "@/lib/data/sites";
import { siteSchema } from "@/lib/validations/fleet";

export const PATCH = workspaceRoute<{ slug: string; siteId: string }>("site.edit", async (request, { access, viewer }, { siteId }) => {
  const body = await readJson(request, siteSchema);
  if (!body.ok) return body.response;
  const site = await updateSite(access.workspace.id, viewer.id, siteId, body.data);
  return site ? NextResponse.json({ site }) : notFound();
});
