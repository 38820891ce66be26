// Upload checks off the request thread and bounded in number: a few worker threads each check one spooled
// upload at a time (audio-check.ts: content sniffing, header parsing, a capped decode); the rest wait in
// line, and past a long line an upload is refused as "busy" rather than queued without end. A check that
// takes too long is stopped (its worker replaced) and the upload refused, so nothing waits forever.
import path from 'node:path';
import { Worker } from 'node:worker_threads';
import { config } from '@/server/config';
import { HttpError } from '@/server/http';
import type { CheckedAudio } from './audio-check';
import type { CheckReply, CheckRequest } from './check-worker';

/**
 * A check streams the file through ffmpeg and keeps no samples, but the decoder's output arrives as 64 KB
 * Buffers that are garbage at once: with V8's default young generation each worker's heap grew by tens of MB
 * while ten large uploads were checked. A small one is collected sooner (the bench's ten 100 MB uploads:
 * +176–179 MB of server memory before, +91–95 MB after).
 */
const CHECK_WORKER_LIMITS = { maxOldGenerationSizeMb: 64, maxYoungGenerationSizeMb: 4 };

interface Waiting {
  request: Omit<CheckRequest, 'id'>;
  resolve: (audio: CheckedAudio) => void;
  reject: (err: Error) => void;
}

interface Slot {
  worker: Worker;
  busy: (Waiting & { id: number; timer: ReturnType<typeof setTimeout> }) | null;
}

export class CheckPool {
  private slots: Slot[] = [];
  private line: Waiting[] = [];
  private nextId = 1;
  private closed = false;

  constructor(
    private readonly size = config.uploads.concurrentChecks,
    private readonly maxWaiting = config.uploads.maxWaitingChecks,
    private readonly timeoutMs = config.uploads.checkTimeoutMs,
  ) {}

  /** The checked audio of a spooled upload, or the HttpError that refuses it. */
  check(file: string, maxDurationSec: number): Promise<CheckedAudio> {
    if (this.line.length >= this.maxWaiting) {
      return Promise.reject(
        new HttpError(503, 'busy', 'too many uploads are being checked right now; try again in a minute', 'file'),
      );
    }
    return new Promise((resolve, reject) => {
      this.line.push({ request: { file, maxDurationSec }, resolve, reject });
      this.next();
    });
  }

  /** Starts every worker now, so their memory is taken at start-up rather than in the middle of the first uploads. */
  warm() {
    while (this.slots.length < this.size) this.spawn();
    return this;
  }

  /** How many checks run and wait now. */
  load() {
    return { running: this.slots.filter((s) => s.busy).length, waiting: this.line.length };
  }

  async close() {
    this.closed = true;
    await Promise.all(this.slots.map((s) => s.worker.terminate()));
  }

  private next() {
    while (this.line.length && !this.closed) {
      const slot = this.slots.find((s) => !s.busy) ?? (this.slots.length < this.size ? this.spawn() : null);
      if (!slot) return;
      const waiting = this.line.shift()!;
      const id = this.nextId++;
      const timer = setTimeout(() => this.timedOut(slot), this.timeoutMs);
      slot.busy = { ...waiting, id, timer };
      slot.worker.postMessage({ id, ...waiting.request } satisfies CheckRequest);
    }
  }

  private spawn(): Slot {
    // The worker is TypeScript: loaded through tsx, as the server itself is run (see jobs/runner.ts).
    const file = path.join(__dirname, 'check-worker.ts');
    const worker = new Worker(`require('tsx/cjs'); require(${JSON.stringify(file)});`, {
      eval: true,
      resourceLimits: CHECK_WORKER_LIMITS,
    });
    const slot: Slot = { worker, busy: null };
    worker.unref();
    worker.on('message', (reply: CheckReply) => this.settle(slot, reply));
    worker.on('error', (err) => console.error('[tactus] upload check worker error:', err));
    worker.on('exit', () => this.replace(slot, new Error('the upload check stopped unexpectedly')));
    this.slots.push(slot);
    return slot;
  }

  private settle(slot: Slot, reply: CheckReply) {
    const job = slot.busy;
    if (!job || job.id !== reply.id) return;
    clearTimeout(job.timer);
    slot.busy = null;
    if (reply.ok) job.resolve(reply.audio);
    else if (reply.refused) {
      const { status, code, message, field } = reply.refused;
      job.reject(new HttpError(status, code, message, field));
    } else job.reject(new Error(reply.failure));
    this.next();
  }

  private timedOut(slot: Slot) {
    const job = slot.busy;
    if (!job) return;
    slot.busy = null;
    job.reject(new HttpError(422, 'bad_audio', 'this file took too long to check; it may be damaged', 'file'));
    // The worker may be stuck in the file: replace it.
    this.slots = this.slots.filter((s) => s !== slot);
    slot.worker.removeAllListeners('exit');
    void slot.worker.terminate();
    this.next();
  }

  private replace(slot: Slot, err: Error) {
    this.slots = this.slots.filter((s) => s !== slot);
    if (slot.busy) {
      clearTimeout(slot.busy.timer);
      slot.busy.reject(err);
    }
    if (!this.closed) this.next();
  }
}

let pool: CheckPool | null = null;

/** The process's one pool, started on first use. */
export const checkPool = () => (pool ??= new CheckPool());
