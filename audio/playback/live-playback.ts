// Live playback of a recording at a changeable tempo, block by block: what the audio thread runs (the player's
// AudioWorklet, or a ScriptProcessor where there is none). Pure TypeScript, so Node tests run the same code.
//
// A tempo change is applied at the start of the next block: a new stretcher starts at the exact musical
// position the timeline gives for that moment, cross-faded from the old one over a few milliseconds. (SoundTouch
// keeps up to ~16 k frames of already-stretched audio queued, so changing its tempo in place would be heard a
// third of a second late.) Loops run on a straight timeline over a looped source (audio/practice/passage.ts).
import {
  loopedSource,
  planarSource,
  Stretcher,
  type MakeStretcher,
  type StereoBuffer,
  type TimeStretcher,
} from './stretch';
import { PlaybackMap, type PlaybackSegment } from './click';
import { loopPass, type Passage } from '@/audio/practice/passage';

const CROSSFADE = 256;

export interface StartOptions {
  /** Seconds into the recording. */
  fromSec: number;
  /** × the recording's own tempo. */
  speed: number;
  /** Context time at which the music comes in (after a count-in, say). */
  startsAt: number;
  loop: Passage | null;
}

/** What one rendered block changed: a new timeline segment (a tempo change took effect), a finished loop pass. */
export interface BlockEvents {
  segment?: PlaybackSegment & { requestedAt: number };
  pass?: number;
}

export class LivePlayback {
  private stretcher: TimeStretcher | null = null;
  private map: PlaybackMap | null = null;
  private loop: Passage | null = null;
  private startsAt = 0;
  private begun = false;
  private passes = 0;
  private pending: { speed: number; requestedAt: number } | null = null;
  private scratch = new Float32Array(0);
  private fade = new Float32Array(2 * CROSSFADE);

  constructor(
    private readonly audio: StereoBuffer,
    readonly sampleRate: number,
    /** The stretch method (audio/playback/stretch-method.ts); SoundTouch's overlap-add unless told. */
    private readonly makeStretcher: MakeStretcher = (source, tempo) => new Stretcher(source, tempo, sampleRate),
  ) {}

  get active() {
    return this.map !== null;
  }

  /**
   * Runs the stretch once on a few blocks and throws the result away, so the engine's first real start and first
   * tempo change do not pay for the JavaScript compiler's warm-up inside a block (measured: 13 ms instead of 1 ms).
   */
  warmUp() {
    const l = new Float32Array(128);
    const r = new Float32Array(128);
    for (const speed of [1, 0.7, 1.4]) {
      this.start({ fromSec: 0, speed: 1, startsAt: 0, loop: null });
      this.requestSpeed(speed, 0);
      for (let i = 0; i < 200; i++) this.render(l, r, 128, (i * 128) / this.sampleRate);
    }
    this.stop();
  }

  /** The first segment of the timeline; the caller's own PlaybackMap starts from the same one. */
  start(o: StartOptions): PlaybackSegment {
    this.loop = o.loop && o.loop.end > o.loop.start ? o.loop : null;
    this.map = new PlaybackMap(o.startsAt, o.fromSec, o.speed);
    this.stretcher = this.newStretcher(o.fromSec, o.speed);
    this.startsAt = o.startsAt;
    this.begun = false;
    this.passes = this.loop ? loopPass(o.fromSec, this.loop) : 0;
    this.pending = null;
    return { at: o.startsAt, from: o.fromSec, speed: o.speed };
  }

  stop() {
    this.map = null;
    this.stretcher = null;
    this.pending = null;
  }

  /** Heard from the next block on. `requestedAt` (context time) is kept to measure how long that took. */
  requestSpeed(speed: number, requestedAt: number) {
    this.pending = { speed, requestedAt };
  }

  /** Fills n frames of both channels for the block heard from context time `blockAt`. */
  render(outL: Float32Array, outR: Float32Array, n: number, blockAt: number): BlockEvents {
    const events: BlockEvents = {};
    if (!this.map || !this.stretcher) {
      outL.fill(0, 0, n);
      outR.fill(0, 0, n);
      return events;
    }
    const sr = this.sampleRate;
    const silent = Math.max(0, Math.min(n, Math.round((this.startsAt - blockAt) * sr)));
    outL.fill(0, 0, silent);
    outR.fill(0, 0, silent);
    if (silent === n) return events;
    const at = blockAt + silent / sr;
    if (!this.begun) {
      this.begun = true;
      // A late first block (the start message came after its time) picks up where the timeline already is.
      if (at > this.startsAt + 1 / sr)
        this.stretcher = this.newStretcher(this.map.recordingTime(at), this.stretcher.tempo);
    }
    const m = n - silent;
    let fadeFrames = 0;
    if (this.pending) {
      // The cross-fade ends within this block (the next one has no old stretcher to fade from).
      fadeFrames = this.stretcher.extract(this.fade, Math.min(CROSSFADE, m));
      const { speed, requestedAt } = this.pending;
      this.pending = null;
      const from = this.map.recordingTime(at);
      this.stretcher = this.newStretcher(from, speed);
      this.map.changeSpeed(at, speed);
      events.segment = { at, from, speed, requestedAt };
    }
    if (this.scratch.length < 2 * m) this.scratch = new Float32Array(2 * m);
    const frames = this.scratch;
    const got = this.stretcher.extract(frames, m);
    for (let i = 0; i < m; i++) {
      let l = i < got ? frames[2 * i]! : 0;
      let r = i < got ? frames[2 * i + 1]! : 0;
      if (i < fadeFrames) {
        const w = i / fadeFrames;
        l = l * w + this.fade[2 * i]! * (1 - w);
        r = r * w + this.fade[2 * i + 1]! * (1 - w);
      }
      outL[silent + i] = l;
      outR[silent + i] = r;
    }
    if (this.loop) {
      const pass = loopPass(this.map.recordingTime(at + m / sr), this.loop);
      if (pass > this.passes) {
        this.passes = pass;
        events.pass = pass;
      }
    }
    return events;
  }

  private newStretcher(fromSec: number, speed: number): TimeStretcher {
    const sr = this.sampleRate;
    const source = this.loop
      ? loopedSource(this.audio, {
          startFrame: Math.round(this.loop.start * sr),
          endFrame: Math.round(this.loop.end * sr),
        })
      : planarSource(this.audio);
    const s = this.makeStretcher(source, speed);
    s.seek(fromSec * sr);
    return s;
  }
}
