import { NextResponse } from "next/server";
import { workspaceRoute } from "@/lib/api";
import { listMembers } from "@/lib/data/members";

export const GET = workspaceRoute("member.list", async (_request, { access }) =>
  NextResponse.json({ members: await listMembers(access.workspace.id) }),
);
