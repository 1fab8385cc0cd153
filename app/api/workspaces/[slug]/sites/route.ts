import { NextResponse } from "next/server";
import { readJson, workspaceRoute } from "@/lib/api";
import { createSite, listSites } from "@/lib/data/sites";
import { siteSchema } from "@/lib/validations/fleet";

export const GET = workspaceRoute("workspace.view", async (_request, { access }) =>
  NextResponse.json({ sites: await listSites(access.workspace.id) }),
);

/** Add a site: name, latitude and longitude in degrees (WGS 84), altitude in metres. */
export const POST = workspaceRoute("site.edit", async (request, { access, viewer }) => {
  const body = await readJson(request, siteSchema);
  if (!body.ok) return body.response;
  return NextResponse.json({ site: await createSite(access.workspace.id, viewer.id, body.data) }, { status: 201 });
});
