import { NextResponse } from "next/server";
import { readJson, userRoute } from "@/lib/api";
import { UserFacingError } from "@/lib/action";
import { createWorkspace, listWorkspacesForUser, SlugTakenError } from "@/lib/data/workspaces";
import { createWorkspaceSchema } from "@/lib/validations/workspace";

export const GET = userRoute(async (_request, viewer) => NextResponse.json({ workspaces: await listWorkspacesForUser(viewer.id) }));

/** Create a workspace with the caller as owner. */
export const POST = userRoute(async (request, viewer) => {
  const body = await readJson(request, createWorkspaceSchema);
  if (!body.ok) return body.response;
  try {
    return NextResponse.json({ workspace: await createWorkspace(viewer.id, body.data) }, { status: 201 });
  } catch (error) {
    if (error instanceof SlugTakenError) throw new UserFacingError(error.message);
    throw error;
  }
});
