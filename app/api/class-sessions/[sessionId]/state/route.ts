import { notFound } from "@/lib/api";
import { sessionRoute } from "@/lib/classroom/session-guard";
import { currentSnapshotJson } from "@/lib/classroom/session-snapshot";

export const dynamic = "force-dynamic";

/** The caller's SessionSnapshot now — the same JSON the event stream sends (first paint, scripts, tests). */
export const GET = sessionRoute("view", async (_request, access) => {
  const snapshot = await currentSnapshotJson(access);
  if (!snapshot) return notFound();
  return new Response(snapshot.json, { headers: { "content-type": "application/json", "cache-control": "no-store" } });
});
