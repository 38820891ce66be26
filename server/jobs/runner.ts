// The analysis pool of one server process: worker threads sized to the machine, each taking one claimed job
// at a time. Jobs come from the shared table (queue.ts), so several processes simply share the work.
import os from 'node:os';
import path from 'node:path';
import { Worker } from 'node:worker_threads';
import { config } from '@/server/config';
import { claimNext, complete, fail, heartbeat, release, type ClaimedJob } from './queue';
import type { WorkMessage } from './analysis-worker';

interface Slot {
  worker: Worker;
  job: ClaimedJob | null;
  progress: number;
}

const HEARTBEAT_MS = 2_000;
const IDLE_POLL_MS = 1_000;

export class AnalysisRunner {
  private slots: Slot[] = [];
  private stopped = false;
  private wake: (() => void) | null = null;
  private beat: ReturnType<typeof setInterval> | null = null;

  constructor(private readonly size = config.analysis.workers || Math.max(1, os.availableParallelism() - 1)) {}

  start() {
    for (let i = 0; i < this.size; i++) this.slots.push(this.spawn());
    this.beat = setInterval(() => void this.heartbeats(), HEARTBEAT_MS);
    void this.loop();
    return this;
  }

  /** New work was queued: look now rather than at the next poll. */
  poke() {
    this.wake?.();
  }

  async stop() {
    this.stopped = true;
    if (this.beat) clearInterval(this.beat);
    this.poke();
    await Promise.all(this.slots.map((s) => s.worker.terminate()));
  }

  private spawn(): Slot {
    // The worker is TypeScript: load it through tsx, as the server itself is run.
    const file = path.join(__dirname, 'analysis-worker.ts');
    const worker = new Worker(`require('tsx/cjs'); require(${JSON.stringify(file)});`, { eval: true });
    const slot: Slot = { worker, job: null, progress: 0 };
    worker.on('message', (m: WorkMessage) => void this.onMessage(slot, m));
    worker.on('error', (err) => console.error('[tactus] analysis worker error:', err));
    worker.on('exit', () => {
      if (this.stopped) return;
      // A dead worker: its job goes back to the queue, and a new worker takes its place.
      const job = slot.job;
      slot.job = null;
      if (job) void release(job, 'the analysis worker stopped unexpectedly').catch(() => {});
      const i = this.slots.indexOf(slot);
      if (i >= 0) this.slots[i] = this.spawn();
      this.poke();
    });
    return slot;
  }

  private async onMessage(slot: Slot, m: WorkMessage) {
    const job = slot.job;
    if (!job) return;
    try {
      if (m.type === 'progress') {
        slot.progress = m.value;
        await heartbeat(job, m.value);
        return;
      }
      if (m.type === 'done') await complete(job, m.result, m.peaks, m.engineMs, m.engineVersion);
      else await fail(job, m.reason);
    } catch (err) {
      console.error('[tactus] could not record an analysis result:', err);
    }
    slot.job = null;
    this.poke();
  }

  private async heartbeats() {
    for (const s of this.slots) if (s.job) await heartbeat(s.job, s.progress).catch(() => {});
  }

  private async loop() {
    while (!this.stopped) {
      const free = this.slots.find((s) => !s.job);
      let claimed: ClaimedJob | null = null;
      if (free) {
        try {
          claimed = await claimNext();
        } catch (err) {
          console.error('[tactus] could not claim an analysis job:', (err as Error).message);
        }
        if (claimed) {
          free.job = claimed;
          free.progress = 0;
          free.worker.postMessage({ storageKey: claimed.storageKey });
          continue;
        }
      }
      await new Promise<void>((resolve) => {
        const timer = setTimeout(resolve, IDLE_POLL_MS);
        this.wake = () => {
          clearTimeout(timer);
          resolve();
        };
      });
      this.wake = null;
    }
  }
}

let runner: AnalysisRunner | null = null;
export const startAnalysisRunner = () => (runner ??= new AnalysisRunner().start());
export const analysisRunner = () => runner;
