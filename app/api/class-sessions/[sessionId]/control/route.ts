import { notFound, readJson } from "@/lib/api";
import { sessionRoute } from "@/lib/classroom/session-guard";
import { currentSnapshotJson } from "@/lib/classroom/session-snapshot";
import { applyControl } from "@/lib/data/class-sessions";
import { controlSchema } from "@/lib/validations/classroom";

export const dynamic = "force-dynamic";

/**
 * The host's controls: play, pause, step (`stepSeconds`, default 5 s of capture), restart,
 * speed (`speed`, 0.25–8 × real time), freeze, unfreeze, reveal, hide, end. The new state is
 * written first, then announced to every server; the answer carries the host's new snapshot.
 */
export const POST = sessionRoute("host", async (request, access) => {
  const body = await readJson(request, controlSchema);
  if (!body.ok) return body.response;
  await applyControl(access.sessionId, access.user!.id, body.data);
  const snapshot = await currentSnapshotJson(access);
  if (!snapshot) return notFound();
  return new Response(`{"snapshot":${snapshot.json}}`, { headers: { "content-type": "application/json", "cache-control": "no-store" } });
});
