// The engine side of the player, whichever thread it runs on: takes the main thread's messages, drives
// LivePlayback block by block, and reports back. The AudioWorklet (audio/playback/worklet/stretch-processor.ts) and the
// ScriptProcessor fallback (client/player.ts) both run this one class.
//
// Messages in: load (right is null for a mono recording; the stretch method asked for), fallback (the main
// thread waited too long for ready: build overlap-add from the same samples), start, speed, stop, reset-stats,
// unload. Messages out: ready (the stretcher is built: the method in use, overlap-add where the phase vocoder
// could not start), segment (a tempo change took effect), pass (the loop came round), stats (time spent
// rendering ÷ audio time rendered, every 64 blocks). Each start is a numbered run, and what the engine reports
// carries the run's number, so a report that crosses a restart in flight is recognised as stale.
import { LivePlayback, type StartOptions } from './live-playback';
import { stretcherMaker } from './stretch-method';
import type { StretchMethod } from '@/shared/schemas';

export type ToEngine =
  | { type: 'load'; left: Float32Array; right: Float32Array | null; method: StretchMethod }
  /** The phase vocoder's set-up has not finished in time (it can hang rather than fail): use overlap-add. */
  | { type: 'fallback' }
  | { type: 'start'; options: StartOptions; run: number }
  | { type: 'speed'; speed: number; requestedAt: number }
  | { type: 'stop' }
  | { type: 'reset-stats' }
  /** The player is gone: drop the samples (the audio context outlives it, being the page's). */
  | { type: 'unload' };

export interface RenderStats {
  busyMs: number;
  audioMs: number;
  blocks: number;
  maxBlockMs: number;
}

export type FromEngine =
  | { type: 'ready'; method: StretchMethod }
  | { type: 'segment'; run: number; at: number; from: number; speed: number; requestedAt: number }
  | { type: 'pass'; run: number; pass: number }
  | ({ type: 'stats' } & RenderStats);

const STATS_EVERY_BLOCKS = 64;
const noStats = (): RenderStats => ({ busyMs: 0, audioMs: 0, blocks: 0, maxBlockMs: 0 });

export class PlaybackHost {
  private playback: LivePlayback | null = null;
  private run = 0;
  /** Numbers each load, so a stretcher that finishes building after a newer load (or unload) is dropped. */
  private loads = 0;
  private stats = noStats();
  /** The load waiting for its stretcher: the samples a fallback rebuilds from (they were handed over, not copied). */
  private pending: Extract<ToEngine, { type: 'load' }> | null = null;
  /** Set by unload: nothing will be played again, and the worklet's processor may end. */
  unloaded = false;

  constructor(
    private readonly sampleRate: number,
    private readonly post: (m: FromEngine) => void,
    /** A millisecond clock for the load figures (performance.now where the scope has it). */
    private readonly now: () => number,
  ) {}

  receive(m: ToEngine) {
    if (m.type === 'load') {
      this.pending = m;
      void this.load(m);
    } else if (m.type === 'fallback') {
      if (this.pending && this.pending.method !== 'overlap-add')
        void this.load({ ...this.pending, method: 'overlap-add' });
    } else if (m.type === 'start') {
      this.run = m.run;
      this.playback?.start(m.options);
    } else if (m.type === 'speed') this.playback?.requestSpeed(m.speed, m.requestedAt);
    else if (m.type === 'stop') this.playback?.stop();
    else if (m.type === 'reset-stats') this.stats = noStats();
    else if (m.type === 'unload') {
      this.loads += 1;
      this.playback = null;
      this.pending = null;
      this.unloaded = true;
    }
  }

  private async load(m: Extract<ToEngine, { type: 'load' }>) {
    const load = ++this.loads;
    let method = m.method;
    const make = await stretcherMaker(method, this.sampleRate).catch(() => {
      method = 'overlap-add';
      return stretcherMaker(method, this.sampleRate);
    });
    if (load !== this.loads) return;
    this.pending = null;
    this.playback = new LivePlayback({ left: m.left, right: m.right ?? m.left }, this.sampleRate, make);
    this.playback.warmUp();
    this.post({ type: 'ready', method });
  }

  /** Fills one block heard from context time `blockAt` (silence when stopped). */
  render(left: Float32Array, right: Float32Array, blockAt: number) {
    if (!this.playback?.active) {
      left.fill(0);
      right.fill(0);
      return;
    }
    const t0 = this.now();
    const events = this.playback.render(left, right, left.length, blockAt);
    const busy = this.now() - t0;
    if (events.segment) this.post({ type: 'segment', run: this.run, ...events.segment });
    if (events.pass !== undefined) this.post({ type: 'pass', run: this.run, pass: events.pass });
    const s = this.stats;
    s.busyMs += busy;
    s.audioMs += (left.length / this.sampleRate) * 1000;
    s.blocks += 1;
    s.maxBlockMs = Math.max(s.maxBlockMs, busy);
    if (s.blocks % STATS_EVERY_BLOCKS === 0) this.post({ type: 'stats', ...s });
  }
}
