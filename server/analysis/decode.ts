// Decoding for the server: Debian's ffmpeg turns any of MP3, WAV, FLAC, OGG/Vorbis and M4A/AAC into mono
// 32-bit float samples at the analysis rate, resampled inside ffmpeg. Measured fastest and the only route
// that read every format here (see README, "Package choices").
import { spawn } from 'node:child_process';
import { ANALYSIS_RATE } from '@/audio/analysis/resample';

export class NotAudioError extends Error {}

export interface Decoded {
  samples: Float32Array;
  sampleRate: number;
}

export function decodeFile(file: string, sampleRate: number = ANALYSIS_RATE): Promise<Decoded> {
  return runDecoder(file, sampleRate, true).then(({ samples }) => ({ samples: samples!, sampleRate }));
}

/**
 * How many seconds of audio a file really holds, decoded and counted without keeping the samples. With
 * `atMostSec`, decoding stops there: a file whose header hides a three-hour length costs no more than the limit.
 */
export function decodedSeconds(file: string, sampleRate = 8000, atMostSec?: number): Promise<number> {
  return runDecoder(file, sampleRate, false, atMostSec).then(({ frames }) => frames / sampleRate);
}

function runDecoder(
  file: string,
  sampleRate: number,
  keep: boolean,
  atMostSec?: number,
): Promise<{ samples: Float32Array | null; frames: number }> {
  return new Promise((resolve, reject) => {
    const ff = spawn(
      process.env.TACTUS_FFMPEG ?? 'ffmpeg',
      [
        '-v',
        'error',
        '-nostdin',
        '-i',
        file,
        '-map',
        '0:a:0',
        '-ac',
        '1',
        '-ar',
        String(sampleRate),
        ...(atMostSec ? ['-t', String(atMostSec)] : []),
        // Samples kept (an analysis): write in full 32 KB blocks, not one small write per decoded frame — on a
        // 5-minute MP3, 10 000 pipe reads became 400 and Node's share of the decode 66–122 ms became 10–16 ms.
        // Samples only counted (an upload's check): the small writes stay, as Node's pooled small buffers; its
        // 64 KB blocks each held memory of their own until collected, and ten uploads checked at once grew the
        // server by +81…+83 MB instead of +48…+56 (analyses held back, `npm run bench -- --uploads`).
        ...(keep ? ['-flush_packets', '0'] : []),
        '-f',
        'f32le',
        '-',
      ],
      { stdio: ['ignore', 'pipe', 'pipe'] },
    );
    const chunks: Buffer[] = [];
    let bytes = 0;
    let stderr = '';
    ff.stdout.on('data', (c: Buffer) => {
      if (keep) chunks.push(c);
      bytes += c.length;
    });
    ff.stderr.on('data', (c: Buffer) => {
      if (stderr.length < 4000) stderr += c.toString();
    });
    ff.on('error', (err) => reject(new Error(`could not run ffmpeg: ${err.message}`)));
    ff.on('close', (code) => {
      if (code !== 0 || bytes < 4) {
        const reason = stderr.split('\n').find((l) => l.trim()) ?? 'no audio stream';
        reject(new NotAudioError(`not a readable audio file (${reason.trim()})`));
        return;
      }
      if (!keep) {
        resolve({ samples: null, frames: Math.floor(bytes / 4) });
        return;
      }
      // Copy into an aligned buffer of whole samples.
      const samples = new Float32Array(Math.floor(bytes / 4));
      const view = new Uint8Array(samples.buffer);
      let at = 0;
      for (const c of chunks) {
        const n = Math.min(c.length, view.length - at);
        view.set(c.subarray(0, n), at);
        at += n;
      }
      resolve({ samples, frames: samples.length });
    });
  });
}
