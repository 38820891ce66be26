// The player's audio-thread half: an AudioWorkletProcessor around LivePlayback. Bundled on its own into
// public/stretch-processor.js (scripts/build-worklet.sh) because a worklet module loads as one plain script.
// Messages in: load (right is null for a mono recording), start, speed, stop, reset-stats. Messages out: segment (a tempo change took effect), pass (the loop
// came round), stats (time spent rendering ÷ audio time rendered). Each start is a numbered run, and what the
// worklet reports carries the run's number, so a report that crosses a restart in flight is recognised as stale.
import { LivePlayback, type StartOptions } from '../live-playback';

// The AudioWorkletGlobalScope, declared here because TypeScript's DOM library does not describe it.
declare const currentTime: number;
declare const sampleRate: number;
declare function registerProcessor(name: string, ctor: unknown): void;
declare class AudioWorkletProcessor {
  readonly port: MessagePort;
}

export type ToWorklet =
  | { type: 'load'; left: Float32Array; right: Float32Array | null }
  | { type: 'start'; options: StartOptions; run: number }
  | { type: 'speed'; speed: number; requestedAt: number }
  | { type: 'stop' }
  | { type: 'reset-stats' };

export type FromWorklet =
  | { type: 'segment'; run: number; at: number; from: number; speed: number; requestedAt: number }
  | { type: 'pass'; run: number; pass: number }
  | { type: 'stats'; busyMs: number; audioMs: number; blocks: number; maxBlockMs: number };

// performance.now() is not offered in every worklet scope; Date.now() ticks in whole milliseconds, but summed
// over many blocks whose start is unrelated to the tick its error averages out.
const now: () => number = typeof performance !== 'undefined' ? () => performance.now() : () => Date.now();

class StretchProcessor extends AudioWorkletProcessor {
  private playback: LivePlayback | null = null;
  private run = 0;
  private stats = { busyMs: 0, audioMs: 0, blocks: 0, maxBlockMs: 0 };

  constructor() {
    super();
    this.port.onmessage = (e: MessageEvent<ToWorklet>) => {
      const m = e.data;
      if (m.type === 'load') {
        this.playback = new LivePlayback({ left: m.left, right: m.right ?? m.left }, sampleRate);
        this.playback.warmUp();
      }
      else if (m.type === 'start') {
        this.run = m.run;
        this.playback?.start(m.options);
      }
      else if (m.type === 'speed') this.playback?.requestSpeed(m.speed, m.requestedAt);
      else if (m.type === 'stop') this.playback?.stop();
      else if (m.type === 'reset-stats') this.stats = { busyMs: 0, audioMs: 0, blocks: 0, maxBlockMs: 0 };
    };
  }

  process(_inputs: Float32Array[][], outputs: Float32Array[][]): boolean {
    const out = outputs[0]!;
    const left = out[0]!;
    const right = out[1] ?? left;
    if (!this.playback?.active) return true;
    const t0 = now();
    const events = this.playback.render(left, right, left.length, currentTime);
    const busy = now() - t0;
    if (events.segment) this.post({ type: 'segment', run: this.run, ...events.segment });
    if (events.pass !== undefined) this.post({ type: 'pass', run: this.run, pass: events.pass });
    const s = this.stats;
    s.busyMs += busy;
    s.audioMs += (left.length / sampleRate) * 1000;
    s.blocks += 1;
    s.maxBlockMs = Math.max(s.maxBlockMs, busy);
    if (s.blocks % 64 === 0) this.post({ type: 'stats', ...s });
    return true;
  }

  private post(m: FromWorklet) {
    this.port.postMessage(m);
  }
}

registerProcessor('tactus-stretch', StretchProcessor);
