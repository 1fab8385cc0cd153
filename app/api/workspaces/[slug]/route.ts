import { NextResponse } from "next/server";
import { workspaceRoute } from "@/lib/api";
import { allowedActions } from "@/lib/permissions";

/** The workspace, the caller's role in it and what that role allows. */
export const GET = workspaceRoute("workspace.view", async (_request, { access }) =>
  NextResponse.json({ workspace: access.workspace, role: access.role, allowed: allowedActions(access.role) }),
);
