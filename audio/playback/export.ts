// Export: the recording, or a passage of it, rendered offline at a chosen tempo (pitch kept) and written as a
// 16-bit PCM WAV file (through wavefile, which writes the RIFF/WAVE header to the format's specification).
import { WaveFile } from 'wavefile';
import { stretchOffline, type StereoBuffer } from './stretch';
import type { Passage } from '@/audio/practice/passage';
import { formatBpm, tenth } from '@/shared/format';

/** The passage (or everything) at `tempo` × the recording's own speed. */
export function renderAtTempo(
  audio: StereoBuffer,
  sampleRate: number,
  tempo: number,
  passage: Passage | null = null,
  /** The stretch method's offline render (the player passes the phase vocoder's when it plays with it). */
  stretch: (audio: StereoBuffer, tempo: number) => StereoBuffer = (part, t) => stretchOffline(part, t, sampleRate),
): StereoBuffer {
  const from = passage ? Math.max(0, Math.round(passage.start * sampleRate)) : 0;
  const to = passage ? Math.min(audio.left.length, Math.round(passage.end * sampleRate)) : audio.left.length;
  if (!(to > from)) throw new RangeError('the passage is empty');
  return stretch({ left: audio.left.subarray(from, to), right: audio.right.subarray(from, to) }, tempo);
}

/** Float samples (−1…1) to 16-bit integers; out-of-range values are clipped rather than wrapped. */
function toInt16(x: Float32Array): Int16Array {
  const out = new Int16Array(x.length);
  for (let i = 0; i < x.length; i++) {
    const v = Math.max(-1, Math.min(1, x[i]!));
    out[i] = v < 0 ? Math.round(v * 32768) : Math.round(v * 32767);
  }
  return out;
}

/** A WAV file (16-bit PCM) of one or more channels of equal length (a recorded take is mono). */
export function encodeWavChannels(channels: Float32Array[], sampleRate: number): Uint8Array {
  const wav = new WaveFile();
  wav.fromScratch(
    channels.length,
    sampleRate,
    '16',
    channels.length === 1 ? toInt16(channels[0]!) : channels.map(toInt16),
  );
  return wav.toBuffer();
}

/** A stereo WAV file (16-bit PCM) of the buffer. */
export function encodeWav(audio: StereoBuffer, sampleRate: number): Uint8Array {
  return encodeWavChannels([audio.left, audio.right], sampleRate);
}

/** The download's name: the title, the tempo and, for a passage, which one. */
export function exportFileName(title: string, bpm: number, passageLabel: string | null): string {
  const safe =
    title
      .replace(/[\\/:*?"<>|]+/g, ' ')
      .replace(/\s+/g, ' ')
      .trim() || 'recording';
  const tempo = `${formatBpm(tenth(bpm))} BPM`;
  return `${safe} - ${passageLabel ? `${passageLabel} - ` : ''}${tempo}.wav`;
}
