import { NextResponse } from "next/server";
import { getTally } from "@/lib/classroom/questions";
import { sessionRoute } from "@/lib/classroom/session-guard";

export const dynamic = "force-dynamic";

/** Every question of the session with its counts and each participant's answer (the host only). */
export const GET = sessionRoute("host", async (_request, access) => NextResponse.json(await getTally(access.sessionId)));
