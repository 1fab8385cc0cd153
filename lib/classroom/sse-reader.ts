/**
 * Reads a Server-Sent Events body (a fetch response's stream) event by event, for scripts,
 * tests and the bench — browsers have EventSource. Follows the WHATWG HTML "server-sent events"
 * parsing rules for the fields used here: event, data (joined by newlines), id, and comments.
 */
export interface ServerSentEvent {
  event: string;
  data: string;
  id: string | null;
}

export class ServerSentEventReader {
  private readonly reader: ReadableStreamDefaultReader<Uint8Array>;
  private readonly decoder = new TextDecoder();
  private buffer = "";
  private lastId: string | null = null;

  constructor(body: ReadableStream<Uint8Array>) {
    this.reader = body.getReader();
  }

  /** The next event with data (comments and bare `retry:` blocks are skipped); null when the stream ends. */
  async next(): Promise<ServerSentEvent | null> {
    for (;;) {
      const event = this.takeEvent();
      if (event) return event;
      if (event === undefined) {
        const { value, done } = await this.reader.read();
        if (done) return null;
        this.buffer += this.decoder.decode(value, { stream: true }).replace(/\r\n?/g, "\n");
      }
    }
  }

  /** The next event of this type, skipping others; throws after `timeoutMs`. */
  async nextOf(type: string, timeoutMs = 10_000, accept: (event: ServerSentEvent) => boolean = () => true): Promise<ServerSentEvent> {
    let timer: NodeJS.Timeout | undefined;
    const timeout = new Promise<never>((_, reject) => {
      timer = setTimeout(() => reject(new Error(`no "${type}" event within ${timeoutMs} ms`)), timeoutMs);
    });
    try {
      for (;;) {
        const event = await Promise.race([this.next(), timeout]);
        if (event === null) throw new Error(`the stream ended before a "${type}" event`);
        if (event.event === type && accept(event)) return event;
      }
    } finally {
      clearTimeout(timer);
    }
  }

  async cancel(): Promise<void> {
    await this.reader.cancel().catch(() => undefined);
  }

  /** One complete block from the buffer: an event, null for a block without data, undefined when none is complete. */
  private takeEvent(): ServerSentEvent | null | undefined {
    const end = this.buffer.indexOf("\n\n");
    if (end < 0) return undefined;
    const block = this.buffer.slice(0, end);
    this.buffer = this.buffer.slice(end + 2);
    let event = "message";
    const data: string[] = [];
    let sawData = false;
    for (const line of block.split("\n")) {
      if (line === "" || line.startsWith(":")) continue;
      const colon = line.indexOf(":");
      const field = colon < 0 ? line : line.slice(0, colon);
      let value = colon < 0 ? "" : line.slice(colon + 1);
      if (value.startsWith(" ")) value = value.slice(1);
      if (field === "event") event = value;
      else if (field === "data") {
        data.push(value);
        sawData = true;
      } else if (field === "id") this.lastId = value;
    }
    return sawData ? { event, data: data.join("\n"), id: this.lastId } : null;
  }
}
