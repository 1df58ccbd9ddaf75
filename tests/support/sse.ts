// A small Server-Sent Events reader for tests: parses `id:`, `event:`, `data:` and comment
// lines from a fetch body, as the EventSource algorithm does (blank line ends an event).

export interface SseEvent {
  id: string | null;
  event: string;
  data: string;
}

export class SseReader {
  readonly events: SseEvent[] = [];
  readonly comments: string[] = [];
  ended = false;
  private buf = '';
  private readonly done: Promise<void>;
  private readonly reader: ReadableStreamDefaultReader<Uint8Array>;
  private wake: () => void = () => undefined;

  constructor(readonly response: Response) {
    if (!response.body) throw new Error('the answer has no body');
    this.reader = response.body.getReader();
    this.done = this.pump();
  }

  private async pump() {
    const decoder = new TextDecoder();
    try {
      for (;;) {
        const { done, value } = await this.reader.read();
        if (done) break;
        this.buf += decoder.decode(value, { stream: true });
        this.parse();
        this.wake();
      }
    } catch {
      /* cancelled or the connection dropped */
    }
    this.ended = true;
    this.wake();
  }

  private parse() {
    for (let end = this.buf.indexOf('\n\n'); end >= 0; end = this.buf.indexOf('\n\n')) {
      const block = this.buf.slice(0, end);
      this.buf = this.buf.slice(end + 2);
      const ev: SseEvent = { id: null, event: 'message', data: '' };
      let hasField = false;
      for (const line of block.split('\n')) {
        if (line.startsWith(':')) {
          this.comments.push(line.slice(1).trim());
          continue;
        }
        const colon = line.indexOf(': ');
        const field = line.slice(0, colon);
        const value = line.slice(colon + 2);
        if (field === 'id') ev.id = value;
        else if (field === 'event') ev.event = value;
        else if (field === 'data') ev.data += value;
        else continue;
        hasField = true;
      }
      if (hasField && ev.data) this.events.push(ev);
    }
  }

  /** Wait until `pred` holds (checked after every piece of the stream), or fail after `timeoutMs`. */
  async until(pred: (r: SseReader) => boolean, timeoutMs = 15_000): Promise<void> {
    const deadline = Date.now() + timeoutMs;
    while (!pred(this)) {
      if (this.ended) throw new Error(`the stream ended after ${this.events.length} events`);
      const left = deadline - Date.now();
      if (left <= 0) throw new Error(`timed out with ${this.events.length} events`);
      await new Promise<void>((resolve) => {
        const t = setTimeout(resolve, Math.min(left, 200));
        this.wake = () => {
          clearTimeout(t);
          resolve();
        };
      });
    }
  }

  async close(): Promise<void> {
    await this.reader.cancel().catch(() => undefined);
    await this.done;
  }

  /** Resolves when the server ends the stream. */
  get finished(): Promise<void> {
    return this.done;
  }
}
