/**
 * A small in-process queue that runs image work one job at a time, after the upload has
 * answered. Decoding a phone photo takes hundreds of megabytes for a moment, so never two at
 * once; the request path only checks the header and stores the original.
 */
export class SerialQueue {
  private tail: Promise<void> = Promise.resolve();
  private waiting = 0;

  /** Jobs queued or running. */
  get size(): number {
    return this.waiting;
  }

  /** Queue a job. A job should handle its own errors; anything it throws is logged here. */
  add(job: () => Promise<void>): void {
    this.waiting += 1;
    this.tail = this.tail
      .then(job)
      .catch((err: unknown) => {
        console.error('photo queue job failed', err);
      })
      .finally(() => {
        this.waiting -= 1;
      });
  }

  /** Resolves once every job queued so far, and any they queued in turn, has finished. */
  async idle(): Promise<void> {
    let seen: Promise<void>;
    do {
      seen = this.tail;
      await seen;
    } while (seen !== this.tail);
  }
}

/** The process's one queue for photo thumbnails and upright copies (tests await `thumbnails.idle()`). */
export const thumbnails = new SerialQueue();
