// A recorded take: the microphone's samples, which the capture worklet hands over in chunks stamped with context
// time, cut to the span the player recorded and moved earlier by the measured latency (a sound played on the
// click arrives `latency` later), then written as a mono WAV file with the export's WAV writer.
import { encodeWavChannels } from '@/audio/playback/export';

export interface CapturedChunk {
  /** Context time of the first sample. */
  time: number;
  samples: Float32Array;
}

/**
 * The samples heard between context times `from` and `to` on the click's clock, given the round-trip latency:
 * input stamped `t` was played at `t − latency`. Gaps (none in practice) are left silent.
 */
export function assembleTake(
  chunks: CapturedChunk[],
  from: number,
  to: number,
  latencySec: number,
  sampleRate: number,
): Float32Array {
  const length = Math.max(0, Math.round((to - from) * sampleRate));
  const out = new Float32Array(length);
  const start = from + latencySec;
  for (const c of chunks) {
    const offset = Math.round((c.time - start) * sampleRate);
    for (let i = Math.max(0, -offset); i < c.samples.length && offset + i < length; i++)
      out[offset + i] = c.samples[i]!;
  }
  return out;
}

/** The take as a WAV file (16-bit PCM, mono), ready to upload like any recording. */
export function takeWav(samples: Float32Array, sampleRate: number): Uint8Array {
  return encodeWavChannels([samples], sampleRate);
}
