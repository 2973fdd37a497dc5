/**
 * Storage for many equal-length vectors, handed out as views into a few large buffers.
 * A typed array of a bar-sized vector is its own backing store (measured 0.75 µs to allocate 173
 * doubles, against about 3 µs for the banded solve of a Lanczos step, which made three), so the
 * eigensolver takes its vectors from here: one allocation per `chunk` vectors; views never
 * move; each arrives zeroed.
 */
export class VectorStore {
  private buffer: Float64Array<ArrayBuffer> | null = null;
  private used = 0;

  /** `size` entries per vector; `chunk` vectors per buffer. */
  constructor(
    readonly size: number,
    private readonly chunk = 16,
  ) {}

  /** A fresh zeroed vector (its storage lives as long as any view of it). */
  take(): Float64Array<ArrayBuffer> {
    if (this.buffer === null || this.used === this.chunk) {
      this.buffer = new Float64Array(this.size * this.chunk);
      this.used = 0;
    }
    const start = this.used * this.size;
    this.used++;
    return this.buffer.subarray(start, start + this.size);
  }
}
