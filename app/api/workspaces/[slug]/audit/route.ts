import { NextResponse } from "next/server";
import { workspaceRoute } from "@/lib/api";
import { listAuditEvents } from "@/lib/data/audit-events";

export const GET = workspaceRoute("audit.view", async (_request, { access }) =>
  NextResponse.json({ events: await listAuditEvents(access.workspace.id, 200) }),
);
