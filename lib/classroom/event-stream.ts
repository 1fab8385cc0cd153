import "server-only";
import type { ViewerSink } from "@/lib/classroom/live-channel";

/**
 * The body of a Server-Sent Events response. A connection that reads slowly does not pile up
 * old frames: once a few frames wait unread, only the newest snapshot and the newest tally are
 * kept (each is the full state, so nothing is lost by skipping the ones in between).
 * A comment line every 15 s keeps proxies from closing an idle connection.
 */
export const SSE_HEADERS = {
  "content-type": "text/event-stream; charset=utf-8",
  // no-transform: a compressing proxy (or the server's own gzip) must not hold frames back.
  "cache-control": "no-store, no-transform",
  "x-accel-buffering": "no",
} as const;

const PING_MS = 15_000;
/** Frames queued before the newest-only rule applies. */
const QUEUE_FRAMES = 4;
/** EventSource waits this long before reconnecting after a drop. */
const RETRY_MS = 2000;

const encoder = new TextEncoder();

export interface EventStream {
  stream: ReadableStream<Uint8Array>;
  sink: ViewerSink;
  /** Run `cleanup` once when the stream ends: the client left (abort or cancel) or the server closed it. */
  onClose(cleanup: () => void): void;
}

export function eventStream(signal: AbortSignal): EventStream {
  let controller!: ReadableStreamDefaultController<Uint8Array>;
  const held = new Map<string, Uint8Array>();
  const cleanups: (() => void)[] = [];
  let closed = false;

  const close = () => {
    if (closed) return;
    closed = true;
    clearInterval(ping);
    held.clear();
    for (const cleanup of cleanups.splice(0)) cleanup();
    try {
      controller.close();
    } catch {
      // already closed or cancelled by the reader
    }
  };
  const room = () => (controller.desiredSize ?? 0) > 0;

  const stream = new ReadableStream<Uint8Array>(
    {
      start(c) {
        controller = c;
        controller.enqueue(encoder.encode(`retry: ${RETRY_MS}\n\n`));
      },
      pull() {
        for (const frame of held.values()) controller.enqueue(frame);
        held.clear();
      },
      cancel() {
        close();
      },
    },
    new CountQueuingStrategy({ highWaterMark: QUEUE_FRAMES }),
  );

  const ping = setInterval(() => {
    if (!closed && room()) controller.enqueue(encoder.encode(": ping\n\n"));
  }, PING_MS);
  ping.unref?.();

  if (signal.aborted) queueMicrotask(close);
  else signal.addEventListener("abort", close, { once: true });

  const sink: ViewerSink = {
    send(frame, kind) {
      if (closed) return;
      if (held.size === 0 && room()) controller.enqueue(frame);
      else {
        held.delete(kind);
        held.set(kind, frame);
      }
    },
    close,
  };
  return {
    stream,
    sink,
    onClose(cleanup) {
      if (closed) cleanup();
      else cleanups.push(cleanup);
    },
  };
}
