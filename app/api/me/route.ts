import { NextResponse } from "next/server";
import { userRoute } from "@/lib/api";
import { listWorkspacesForUser } from "@/lib/data/workspaces";

/** The signed-in user and the workspaces they belong to, with their role in each. */
export const GET = userRoute(async (_request, viewer) => {
  const workspaces = await listWorkspacesForUser(viewer.id);
  return NextResponse.json({ user: viewer, workspaces });
});
