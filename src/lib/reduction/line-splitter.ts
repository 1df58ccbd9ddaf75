// Push-style line splitter: byte chunks in (cut anywhere, even inside a line or between CR and
// LF), whole lines out. Lines are handed over as a byte range of a buffer that is only valid
// during the callback; a line cut by a chunk boundary is joined in a small buffer of its own, so a
// chunk is never copied. Memory: one partial line.

/** Called for each line: bytes [start, end) of buf, without the LF and a CR before it. */
export type LineCallback = (buf: Uint8Array, start: number, end: number) => void;

export class LineSplitter {
  private carry: Uint8Array = new Uint8Array(256);
  private carryLength = 0;
  private finished = false;

  /**
   * @param onLine receives every line in order
   * @param maxLineBytes a partial line longer than this calls onOverlong (which should throw)
   * @param onOverlong called with the partial line's length
   */
  constructor(
    private readonly onLine: LineCallback,
    private readonly maxLineBytes = Infinity,
    private readonly onOverlong: (length: number) => void = () => undefined,
  ) {}

  /** Bytes of the line not yet ended (0 between lines). */
  get pendingBytes(): number {
    return this.carryLength;
  }

  push(bytes: Uint8Array): void {
    if (this.finished) throw new Error('LineSplitter: push after finish');
    const n = bytes.length;
    let pos = 0;
    if (this.carryLength > 0) {
      const nl = bytes.indexOf(10);
      if (nl < 0) {
        this.append(bytes, 0, n);
        return;
      }
      this.append(bytes, 0, nl);
      this.emitCarry();
      pos = nl + 1;
    }
    while (pos < n) {
      const nl = bytes.indexOf(10, pos);
      if (nl < 0) break;
      let end = nl;
      if (end > pos && bytes[end - 1] === 13) end--;
      this.onLine(bytes, pos, end);
      pos = nl + 1;
    }
    if (pos < n) this.append(bytes, pos, n);
  }

  /** The end of the input: a last line without LF is emitted. */
  finish(): void {
    if (this.finished) return;
    this.finished = true;
    if (this.carryLength > 0) this.emitCarry();
  }

  private append(bytes: Uint8Array, from: number, to: number) {
    const len = to - from;
    const need = this.carryLength + len;
    if (need > this.maxLineBytes) this.onOverlong(need);
    if (need > this.carry.length) {
      const grown = new Uint8Array(Math.max(need, this.carry.length * 2));
      grown.set(this.carry.subarray(0, this.carryLength));
      this.carry = grown;
    }
    this.carry.set(bytes.subarray(from, to), this.carryLength);
    this.carryLength = need;
  }

  private emitCarry() {
    let end = this.carryLength;
    if (end > 0 && this.carry[end - 1] === 13) end--;
    this.carryLength = 0;
    this.onLine(this.carry, 0, end);
  }
}
