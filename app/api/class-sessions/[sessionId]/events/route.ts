import { SSE_HEADERS, eventStream } from "@/lib/classroom/event-stream";
import { watchSession } from "@/lib/classroom/live-channel";
import { sessionRoute, takeSeat } from "@/lib/classroom/session-guard";

export const dynamic = "force-dynamic";

/**
 * The live session as Server-Sent Events: `snapshot` (a SessionSnapshot) first and whenever
 * what this viewer sees changes; `tally` for the host when questions or answers change; a
 * comment every 15 s. Reconnecting is simply connecting again: the first event is the full state.
 */
export const GET = sessionRoute("view", async (request, access) => {
  const viewer = await takeSeat(access);
  const { stream, sink, onClose } = eventStream(request.signal);
  try {
    onClose(await watchSession(viewer, sink));
  } catch (error) {
    sink.close();
    throw error;
  }
  return new Response(stream, { headers: SSE_HEADERS });
});
