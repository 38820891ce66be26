// Pitch-preserving time stretch over soundtouchjs (SoundTouch's WSOLA, LGPL-2.1), for offline rendering in
// Node and the browser alike. soundtouchjs works on interleaved stereo frames; two quirks are handled here:
// its last ~16 k frames only come out when silence follows them, so the source is padded, and the output is
// cut to the exact stretched length.
import { SimpleFilter, SoundTouch, type FrameSource } from 'soundtouchjs';

/**
 * SoundTouch's overlap-add copies the input in sequences at the original speed, so within a sequence an attack
 * lands early when slowed down (late when sped up), and at high speeds whole attacks fall in the skipped parts.
 * Its automatic settings use ~120 ms sequences at half speed. Measured with `npm run bench:stretch` (decaying
 * 900 Hz hits over a soft bed, 56 hits): automatic → attacks 113 ms early on average at 0.5×, 43 ms at 0.75×,
 * 22 of 56 lost at 2×; these settings → 46 ms, 21 ms, 16 lost; a 55 Hz bass tone keeps its pitch within 1.6 %
 * (automatic 1.2 %; 30 ms sequences already give 9 %). The rest of the lead is made up in the click
 * (heardOffsetSec).
 */
export const STRETCH_SETTINGS = { sequenceMs: 40, seekWindowMs: 15, overlapMs: 8 } as const;

/**
 * Where the stretched audio's attacks sit relative to the playback timeline at `speed` (seconds; negative =
 * early). A fit to the bench's measurements with STRETCH_SETTINGS (0.5× −47 ms, 0.75× −21, 1× −8, 1.3× −1, 2× +5):
 * lead = k·(1 − 1/speed) + c, k = 34.7 ms, c = −12.3 ms, within 4 ms of each. The player schedules the click
 * this much earlier or later so click and music coincide.
 */
export function heardOffsetSec(speed: number): number {
  return (34.7 * (1 - 1 / speed) - 12.3) / 1000;
}

/** What the audio thread asks of a stretcher, whichever method it uses (this file's, or signalsmith.ts's). */
export interface TimeStretcher {
  readonly tempo: number;
  /** Interleaved stereo frames into target; returns how many were written. */
  extract(target: Float32Array, frames: number): number;
  /** Jump to a frame of the original (seeking). */
  seek(sourceFrame: number): void;
}

/** Makes a stretcher over `source` at `tempo`: LivePlayback makes one per start and per tempo change. */
export type MakeStretcher = (source: FrameSource & { frames: number }, tempo: number) => TimeStretcher;

/** Frames of silence after the end, enough to flush SoundTouch's internal buffers. */
const FLUSH_FRAMES = 32_768;
const BLOCK = 4096;

export interface StereoBuffer {
  left: Float32Array;
  right: Float32Array;
}

/** Planar channels read as interleaved frames, with silence past the end. */
export function planarSource(audio: StereoBuffer): FrameSource & { frames: number } {
  const n = audio.left.length;
  return {
    frames: n,
    extract(target, numFrames, position) {
      const available = Math.max(0, Math.min(numFrames, n + FLUSH_FRAMES - position));
      for (let i = 0; i < available; i++) {
        const p = position + i;
        target[2 * i] = p < n ? audio.left[p]! : 0;
        target[2 * i + 1] = p < n ? audio.right[p]! : 0;
      }
      return available;
    },
  };
}

/**
 * Planar channels with a passage repeated end to start: source frame p past the passage's end reads frame
 * start + (p − start) mod length, so a stretcher fed from it loops seamlessly (its overlap-add smooths the seam).
 */
export function loopedSource(
  audio: StereoBuffer,
  loop: { startFrame: number; endFrame: number } | null,
): FrameSource & { frames: number } {
  if (!loop) return planarSource(audio);
  const { startFrame, endFrame } = loop;
  const len = endFrame - startFrame;
  if (!(len > 0)) throw new RangeError('the loop is empty');
  return {
    frames: Infinity,
    extract(target, numFrames, position) {
      for (let i = 0; i < numFrames; i++) {
        let p = position + i;
        if (p >= endFrame) p = startFrame + ((p - startFrame) % len);
        target[2 * i] = audio.left[p] ?? 0;
        target[2 * i + 1] = audio.right[p] ?? 0;
      }
      return numFrames;
    },
  };
}

/** Input frames handed to SoundTouch at a time (it takes 16 384 by default). */
const FEED_FRAMES = 2048;

/**
 * SimpleFilter feeds SoundTouch 16 384 frames at once and stretches them in one go: in a 128-frame audio block
 * that is a spike of several milliseconds (the block's budget is 2.9 ms). Fed in small steps, the work is
 * spread over the blocks that use it.
 */
class SteadyFilter extends SimpleFilter {
  override fillOutputBuffer(numFrames = 0) {
    while (this.outputBuffer.frameCount < numFrames) {
      const before = this.inputBuffer.frameCount;
      this.fillInputBuffer(FEED_FRAMES);
      // The source has run dry: stop as SimpleFilter does (the source pads silence to flush the tail).
      if (this.inputBuffer.frameCount === before) break;
      this.pipe.process();
    }
  }
}

/**
 * A running stretcher at one tempo: a tempo change starts a new one at the same musical position
 * (audio/playback/live-playback.ts), which is heard at once where changing SoundTouch's tempo in place is not.
 */
export class Stretcher implements TimeStretcher {
  private readonly pipe = new SoundTouch();
  private readonly filter: SimpleFilter;

  constructor(source: FrameSource, tempo: number, sampleRate = 44100) {
    const { sequenceMs, seekWindowMs, overlapMs } = STRETCH_SETTINGS;
    this.pipe.stretch.setParameters(sampleRate, sequenceMs, seekWindowMs, overlapMs);
    this.pipe.tempo = tempo;
    this.filter = new SteadyFilter(source, this.pipe);
  }

  get tempo() {
    return this.pipe.tempo;
  }

  /** Interleaved stereo frames into target; returns how many were written. */
  extract(target: Float32Array, frames: number): number {
    return this.filter.extract(target, frames);
  }

  /** Jump to a frame of the original (seeking). */
  seek(sourceFrame: number) {
    this.filter.sourcePosition = Math.max(0, Math.round(sourceFrame));
  }
}

/**
 * The whole buffer at `tempo` × its speed (1.25 = a quarter faster; the same pitch). The result has exactly
 * round(frames / tempo) frames.
 */
export function stretchOffline(audio: StereoBuffer, tempo: number, sampleRate = 44100): StereoBuffer {
  if (!(tempo >= 0.25 && tempo <= 4)) throw new RangeError('tempo factor must lie between 0.25 and 4');
  const source = planarSource(audio);
  const outFrames = Math.round(source.frames / tempo);
  const left = new Float32Array(outFrames);
  const right = new Float32Array(outFrames);
  const stretcher = new Stretcher(source, tempo, sampleRate);
  const block = new Float32Array(2 * BLOCK);
  let written = 0;
  while (written < outFrames) {
    const got = stretcher.extract(block, Math.min(BLOCK, outFrames - written));
    if (got === 0) break;
    for (let i = 0; i < got; i++) {
      left[written + i] = block[2 * i]!;
      right[written + i] = block[2 * i + 1]!;
    }
    written += got;
  }
  return { left, right };
}
