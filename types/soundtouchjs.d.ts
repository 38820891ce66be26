// soundtouchjs ships no types; these cover the parts Tactus uses (audio/playback/stretch.ts).
declare module 'soundtouchjs' {
  export interface FrameSource {
    /** Writes up to numFrames interleaved stereo frames from `position` into target; returns frames written. */
    extract(target: Float32Array, numFrames: number, position: number): number;
  }
  export class SoundTouch {
    /** The overlap-add stage; setParameters(sampleRate, sequenceMs, seekWindowMs, overlapMs), 0 = automatic. */
    readonly stretch: {
      setParameters(sampleRate: number, sequenceMs: number, seekWindowMs: number, overlapMs: number): void;
    };
    tempo: number;
    rate: number;
    pitch: number;
    clear(): void;
  }
  export class SimpleFilter {
    constructor(source: FrameSource, pipe: SoundTouch, callback?: () => void);
    readonly pipe: SoundTouch & { process(): void };
    readonly inputBuffer: { readonly frameCount: number };
    readonly outputBuffer: { readonly frameCount: number };
    fillInputBuffer(numFrames: number): void;
    fillOutputBuffer(numFrames: number): void;
    extract(target: Float32Array, numFrames: number): number;
    sourcePosition: number;
    readonly position: number;
    clear(): void;
  }
}
