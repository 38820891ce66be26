// What the capture worklet does with each block of microphone input, kept apart from the AudioWorkletProcessor
// (audio/live/worklet/capture-processor.ts) so it runs in Node under test and benchmark. It finds onsets
// (onsets.ts), reports the input level for the meter, and, while recording, hands the samples to the main
// thread in chunks. Times are context times of the block's first sample, the same clock the click uses.
import { OnsetDetector } from './onsets';

export type ToCapture =
  /** Keep the samples from context time `from` on (the start of the count-in) until stop. */
  { type: 'record'; from: number } | { type: 'stop' } | { type: 'stats' } | { type: 'unload' };

export type FromCapture =
  /**
   * The microphone is live: the context time of its first sample that is not digital silence (a real input
   * always has some noise), or of the end of a second of exact zeros (a muted input still records).
   */
  | { type: 'live'; time: number }
  | { type: 'onset'; time: number }
  /** Peak level (0…1) of the input over the last LEVEL_SEC. */
  | { type: 'level'; peak: number; time: number }
  /** Recorded samples, the first at context time `time`. */
  | { type: 'audio'; time: number; samples: Float32Array }
  /** Sent after stop: no more audio for this recording. */
  | { type: 'stopped' }
  | { type: 'stats'; busyMs: number; audioMs: number; blocks: number; maxBlockMs: number };

/** The meter is refreshed this often: smooth to the eye, few messages. */
const LEVEL_SEC = 0.05;
/** After this long of exact zeros the input counts as live anyway (a hardware mute switch, a silent interface). */
const SILENT_START_SEC = 1;
/** Recorded samples go to the main thread in chunks of about this length (fewer, larger messages). */
const CHUNK_SEC = 0.1;

export class CaptureHost {
  private readonly detector: OnsetDetector;
  private recordFrom: number | null = null;
  private chunk: Float32Array;
  private chunkLength = 0;
  private chunkTime = 0;
  private levelPeak = 0;
  private levelFrames = 0;
  private live = false;
  private zeros = 0;
  private stats = { busyMs: 0, audioMs: 0, blocks: 0, maxBlockMs: 0 };
  unloaded = false;

  constructor(
    private readonly sampleRate: number,
    private readonly post: (m: FromCapture, transfer?: Transferable[]) => void,
    /** A millisecond clock for the load figures. */
    private readonly now: () => number,
  ) {
    this.detector = new OnsetDetector(sampleRate);
    this.chunk = new Float32Array(Math.round(CHUNK_SEC * sampleRate));
  }

  receive(m: ToCapture) {
    if (m.type === 'record') {
      this.recordFrom = m.from;
      this.chunkLength = 0;
    } else if (m.type === 'stop') {
      this.flush();
      this.recordFrom = null;
      this.post({ type: 'stopped' });
    } else if (m.type === 'stats') this.post({ type: 'stats', ...this.stats });
    else if (m.type === 'unload') this.unloaded = true;
  }

  /** One block of input (mono), its first sample at context time `time`. */
  process(input: Float32Array, time: number) {
    const t0 = this.now();
    if (!this.live) this.findLive(input, time);
    for (const onset of this.detector.push(input, time)) this.post({ type: 'onset', time: onset });
    this.meter(input, time);
    if (this.recordFrom !== null) this.keep(input, time);
    const busy = this.now() - t0;
    this.stats.busyMs += busy;
    this.stats.audioMs += (input.length / this.sampleRate) * 1000;
    this.stats.blocks++;
    this.stats.maxBlockMs = Math.max(this.stats.maxBlockMs, busy);
  }

  private findLive(input: Float32Array, time: number) {
    let first = -1;
    for (let i = 0; i < input.length; i++)
      if (input[i] !== 0) {
        first = i;
        break;
      }
    if (first < 0) {
      this.zeros += input.length;
      if (this.zeros < SILENT_START_SEC * this.sampleRate) return;
      first = input.length;
    }
    this.live = true;
    this.post({ type: 'live', time: time + first / this.sampleRate });
  }

  private meter(input: Float32Array, time: number) {
    for (let i = 0; i < input.length; i++) this.levelPeak = Math.max(this.levelPeak, Math.abs(input[i]!));
    this.levelFrames += input.length;
    if (this.levelFrames >= LEVEL_SEC * this.sampleRate) {
      this.post({ type: 'level', peak: Math.min(1, this.levelPeak), time });
      this.levelPeak = 0;
      this.levelFrames = 0;
    }
  }

  private keep(input: Float32Array, time: number) {
    // Samples before the start of the recording are skipped to the sample.
    const skip = Math.max(0, Math.min(input.length, Math.ceil((this.recordFrom! - time) * this.sampleRate - 1e-6)));
    for (let i = skip; i < input.length; i++) {
      if (this.chunkLength === 0) this.chunkTime = time + i / this.sampleRate;
      this.chunk[this.chunkLength++] = input[i]!;
      if (this.chunkLength === this.chunk.length) this.flush();
    }
  }

  private flush() {
    if (this.chunkLength === 0) return;
    const samples = this.chunk.slice(0, this.chunkLength);
    this.post({ type: 'audio', time: this.chunkTime, samples }, [samples.buffer]);
    this.chunkLength = 0;
  }
}
