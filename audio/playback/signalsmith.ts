// The second stretcher: signalsmith-stretch (MIT; a phase vocoder compiled to WebAssembly), behind the same
// interface as the SoundTouch one (audio/playback/stretch.ts), for Node and the browser's audio thread alike.
//
// The package's only export is a Web Audio node that runs the library in an AudioWorklet of its own; we need the
// library inside ours (LivePlayback, on the same timeline as the click) and in Node. So the package is evaluated in
// a stand-in worklet scope (./signalsmith-scope), where it registers its processor class; a processor built from
// that class compiles the WebAssembly module, which we keep, driving the library's C interface (_configure,
// _setBuffers, _seek, _process) ourselves.
import { standIn } from './signalsmith-scope';
import 'signalsmith-stretch';
import type { FrameSource } from 'soundtouchjs';
import { planarSource } from './stretch';

standIn.restore();

/** The library's C interface as the WebAssembly module exposes it (the names the package's own processor uses). */
interface SignalsmithWasm {
  _main(): void;
  _configure(channels: number, blockSamples: number, intervalSamples: number, splitComputation: boolean): void;
  _setBuffers(channels: number, length: number): number;
  _inputLatency(): number;
  _outputLatency(): number;
  _reset(): void;
  _seek(inputSamples: number, rate: number): void;
  _process(inputSamples: number, outputSamples: number): void;
  HEAP8?: Int8Array;
  exports?: { memory: WebAssembly.Memory };
}

let queue: Promise<unknown> = Promise.resolve();

/**
 * One WebAssembly instance of the library, from a processor of the captured class. Its start-up reads the worklet
 * global `sampleRate` (stood in for where there is none, until the module is ready; each engine then sets its own
 * rate). Builds run one at a time.
 */
function buildWasm(): Promise<SignalsmithWasm> {
  const build = queue.then(async () => {
    const Processor = standIn.processor;
    if (!Processor) throw new Error('signalsmith-stretch did not register its processor');
    const scope = globalThis as Record<string, unknown>;
    const ownRate = Object.getOwnPropertyDescriptor(scope, 'sampleRate') === undefined && !('sampleRate' in scope);
    if (ownRate) scope.sampleRate = 44100;
    try {
      const ready = new Promise<void>((resolve) => (standIn.onReady = resolve));
      // The constructor starts the module's build (no timers here: a worklet scope has none).
      const processor = new Processor({ numberOfOutputs: 1, outputChannelCount: [2] });
      await ready;
      if (!processor.wasmModule) throw new Error('signalsmith-stretch did not start');
      return processor.wasmModule as SignalsmithWasm;
    } finally {
      standIn.onReady = null;
      if (ownRate) delete scope.sampleRate;
    }
  });
  queue = build.catch(() => undefined);
  return build;
}

/**
 * Output thrown away after a (re)start, before the first frame heard (93 ms): without it a start or tempo change
 * dips toward silence for 20–50 ms while the overlap-add fills; 2048 frames still left a dip to 82 % of the level
 * (a 440 Hz tone through LivePlayback). The cost, about 1.7 ms of work in the block of a start or tempo change.
 */
const PREROLL_FRAMES = 4096;

/** Longest piece of output rendered in one call; the input for it is at most MAX_TEMPO times as long. */
const CHUNK = 1024;
const MAX_TEMPO = 4;

/**
 * One WebAssembly instance of the library: it holds one stretch at a time, so a player owns one engine and each
 * stretcher made from it takes the engine over (a tempo change ends the previous stretcher's use of it).
 */
export class SignalsmithEngine {
  private owner: object | null = null;
  private pointer = 0;
  private length = 0;

  private constructor(
    private readonly wasm: SignalsmithWasm,
    readonly sampleRate: number,
  ) {
    // The library's default block (120 ms) and interval (a quarter of it), with each block's work spread over the
    // interval's audio blocks instead of falling on one of them (a 128-frame block has 2.9 ms).
    wasm._configure(2, Math.round(0.12 * sampleRate), Math.round(0.03 * sampleRate), true);
    wasm._reset();
    this.inputLatency = wasm._inputLatency();
    this.outputLatency = wasm._outputLatency();
    // Long enough for a whole seek (one analysis block and the output's delay) and for a chunk's input.
    this.length = Math.max(this.inputLatency + this.outputLatency, CHUNK * MAX_TEMPO);
    this.pointer = wasm._setBuffers(2, this.length);
    this.scratch = new Float32Array(2 * this.length);
  }

  /** Interleaved frames read from the source before they are split into the engine's channels. */
  private readonly scratch: Float32Array;

  readonly inputLatency: number;
  readonly outputLatency: number;

  /** Builds the WebAssembly module (asynchronous: the browser compiles it off the audio thread's clock). */
  static async create(sampleRate: number): Promise<SignalsmithEngine> {
    return new SignalsmithEngine(await buildWasm(), sampleRate);
  }

  private channel(kind: 'in' | 'out', c: number, frames: number): Float32Array {
    const memory = this.wasm.exports ? this.wasm.exports.memory.buffer : this.wasm.HEAP8!.buffer;
    const index = kind === 'in' ? c : c + 2;
    return new Float32Array(memory, this.pointer + this.length * 4 * index, frames);
  }

  /** Makes `owner` the one stretch running on this engine, starting with input ending at source frame `end`. */
  claim(owner: object, source: FrameSource, end: number, tempo: number) {
    this.owner = owner;
    this.wasm._reset();
    this.fill(source, end - this.length, this.length);
    this.wasm._seek(this.length, tempo);
  }

  owns(owner: object) {
    return this.owner === owner;
  }

  /** Source frames [from, from + frames) into the engine's input buffers (silence before the start). */
  private fill(source: FrameSource, from: number, frames: number) {
    const scratch = this.scratch;
    const left = this.channel('in', 0, frames);
    const right = this.channel('in', 1, frames);
    const lead = Math.max(0, Math.min(frames, -from));
    left.fill(0, 0, lead);
    right.fill(0, 0, lead);
    const n = frames - lead;
    const got = n > 0 ? source.extract(scratch, n, from + lead) : 0;
    for (let i = 0; i < n; i++) {
      left[lead + i] = i < got ? scratch[2 * i]! : 0;
      right[lead + i] = i < got ? scratch[2 * i + 1]! : 0;
    }
  }

  /** Feeds `inFrames` source frames from `from` and writes `outFrames` interleaved frames into target at `at`. */
  process(source: FrameSource, from: number, inFrames: number, outFrames: number, target: Float32Array, at: number) {
    this.fill(source, from, inFrames);
    this.wasm._process(inFrames, outFrames);
    const left = this.channel('out', 0, outFrames);
    const right = this.channel('out', 1, outFrames);
    for (let i = 0; i < outFrames; i++) {
      target[2 * (at + i)] = left[i]!;
      target[2 * (at + i) + 1] = right[i]!;
    }
  }
}

/**
 * A running stretch at one tempo on a SignalsmithEngine, with the SoundTouch Stretcher's interface. The library
 * hears `inputLatency` ahead of its output and delays its output by `outputLatency`; the first seek reaches that
 * far ahead so that output frame 0 is the source at the starting position.
 */
export class SignalsmithStretcher {
  /** Source frame the next output frame stands for (fractional: the tempo need not divide a chunk evenly). */
  private position = 0;
  /** Source frames already handed to the engine, up to (not including) this one. */
  private fed = 0;
  private started = false;
  private readonly discard = new Float32Array(2 * CHUNK);

  constructor(
    private readonly engine: SignalsmithEngine,
    private readonly source: FrameSource & { frames: number },
    readonly tempo: number,
  ) {
    if (!(tempo >= 1 / MAX_TEMPO && tempo <= MAX_TEMPO))
      throw new RangeError('tempo factor must lie between 0.25 and 4');
  }

  /** Jump to a frame of the original (seeking). */
  seek(sourceFrame: number) {
    this.position = Math.max(0, Math.round(sourceFrame));
    this.started = false;
  }

  /**
   * Takes the engine over at `position`. A freshly reset phase vocoder is silent until its overlap-add has filled,
   * so it starts PREROLL_FRAMES of output earlier and throws those away: the first frame heard is at full level.
   */
  private start() {
    const { engine } = this;
    this.position -= PREROLL_FRAMES * this.tempo;
    this.fed = Math.round(this.position + engine.inputLatency + engine.outputLatency * this.tempo);
    engine.claim(this, this.source, this.fed, this.tempo);
    this.started = true;
    for (let left = PREROLL_FRAMES; left > 0; left -= CHUNK) this.render(this.discard, Math.min(CHUNK, left));
  }

  /** Interleaved stereo frames into target; returns how many were written (always `frames`: silence past the end). */
  extract(target: Float32Array, frames: number): number {
    if (!this.started || !this.engine.owns(this)) this.start();
    this.render(target, frames);
    return frames;
  }

  private render(target: Float32Array, frames: number) {
    for (let done = 0; done < frames;) {
      const n = Math.min(CHUNK, frames - done);
      const next = this.position + n * this.tempo;
      const until = Math.round(next + this.engine.inputLatency + this.engine.outputLatency * this.tempo);
      this.engine.process(this.source, this.fed, until - this.fed, n, target, done);
      this.fed = until;
      this.position = next;
      done += n;
    }
  }
}

/** The whole buffer at `tempo` × its speed on `engine` (as stretchOffline does with SoundTouch). */
export function stretchOfflineSignalsmith(
  engine: SignalsmithEngine,
  audio: { left: Float32Array; right: Float32Array },
  tempo: number,
): { left: Float32Array; right: Float32Array } {
  const source = planarSource(audio);
  const outFrames = Math.round(source.frames / tempo);
  const left = new Float32Array(outFrames);
  const right = new Float32Array(outFrames);
  const stretcher = new SignalsmithStretcher(engine, source, tempo);
  const block = new Float32Array(2 * CHUNK);
  for (let written = 0; written < outFrames;) {
    const n = Math.min(CHUNK, outFrames - written);
    stretcher.extract(block, n);
    for (let i = 0; i < n; i++) {
      left[written + i] = block[2 * i]!;
      right[written + i] = block[2 * i + 1]!;
    }
    written += n;
  }
  return { left, right };
}

/** Where this stretcher's attacks sit against the timeline (as heardOffsetSec for SoundTouch); fitted below. */
export function signalsmithHeardOffsetSec(_speed: number): number {
  return 0;
}
