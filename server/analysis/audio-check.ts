// Is an upload an audio file we accept? Judged by its content (music-metadata sniffs the bytes; the file
// name and the Content-Type header are never consulted), then decoded once to be sure it holds what its
// header claims (a truncated file, or a WAV whose header promises more data than it has, is refused).
// Decoding stops just past the duration limit, so a file whose header hides hours of audio costs no more
// than a file at the limit. The server runs these checks in worker threads (check-pool.ts), a few at once.
import fs from 'node:fs';
import { fileTypeFromFile } from 'file-type';
import { parseFile } from 'music-metadata';
import { decodedSeconds, NotAudioError } from './decode';
import { HttpError } from '@/server/http';
import type { AudioFormat } from '@/server/models/Recording';
import { plural } from '@/shared/format';

export interface CheckedAudio {
  format: AudioFormat;
  mimeType: string;
  durationSec: number;
}

const MIME: Record<AudioFormat, string> = {
  mp3: 'audio/mpeg',
  wav: 'audio/wav',
  flac: 'audio/flac',
  ogg: 'audio/ogg',
  m4a: 'audio/mp4',
};

function formatOf(container: string | undefined, codec: string | undefined): AudioFormat | null {
  const c = (container ?? '').toLowerCase();
  const k = (codec ?? '').toLowerCase();
  if (c === 'mpeg' && (k.includes('layer 3') || k === 'mp3' || k === '')) return 'mp3';
  if (c === 'wave') return 'wav';
  if (c === 'flac') return 'flac';
  if (c === 'ogg' && (k.includes('vorbis') || k.includes('opus'))) return 'ogg';
  if ((c.startsWith('m4a') || c.startsWith('mp4') || c.includes('isom') || c.includes('mp42')) && k.includes('aac'))
    return 'm4a';
  return null;
}

/** Decoded past the limit by this much, so a file a little over it is told its length is over. */
const DECODE_MARGIN_SEC = 5;

const refuse = (message: string, status = 400) => new HttpError(status, 'bad_audio', message, 'file');

export async function checkAudio(file: string, maxDurationSec: number): Promise<CheckedAudio> {
  const { size } = await fs.promises.stat(file);
  if (size === 0) throw refuse('the file is empty');
  // The container is named from the file's first bytes by file-type; music-metadata then parses the file with
  // that container's parser, chosen through a hard link named with the sniffed extension. (Its own content
  // sniffing picks no parser for MPEG audio in this set-up, and it chooses by extension when it has one.)
  const sniffed = await fileTypeFromFile(file).catch(() => undefined);
  if (!sniffed) throw refuse('this is not an audio file Tactus can read (MP3, WAV, FLAC, OGG or M4A)', 415);
  const named = `${file}.${sniffed.ext}`;
  let meta;
  try {
    await fs.promises.link(file, named);
    meta = await parseFile(named, { duration: true, skipCovers: true });
  } catch {
    throw refuse(
      `this ${sniffed.ext.toUpperCase()} file is not audio Tactus can read (MP3, WAV, FLAC, OGG or M4A)`,
      415,
    );
  } finally {
    await fs.promises.rm(named, { force: true });
  }
  const format = formatOf(meta.format.container, meta.format.codec);
  if (!format) {
    throw refuse(`${meta.format.container ?? 'this'} files are not supported: use MP3, WAV, FLAC, OGG or M4A`, 415);
  }
  if (format === 'wav') await checkWavData(file, size);
  const declared = meta.format.duration ?? 0;
  // A header that gives no channels or no sample rate yields an infinite or negative length: it is damaged.
  if (!Number.isFinite(declared) || declared < 0 || meta.format.numberOfChannels === 0) {
    throw refuse('the file’s header is damaged (it declares no audio channels or no length)', 415);
  }
  if (declared > maxDurationSec) {
    throw refuse(
      `the recording is ${plural(Math.round(declared / 60), 'minute')} long; the limit is ${plural(Math.round(maxDurationSec / 60), 'minute')}`,
      413,
    );
  }
  // Decode once, counting what is really there without keeping it (memory stays flat).
  let decodedSec: number;
  try {
    decodedSec = await decodedSeconds(file, 8000, maxDurationSec + DECODE_MARGIN_SEC);
  } catch (err) {
    if (err instanceof NotAudioError) throw refuse('the audio in this file cannot be decoded', 415);
    throw err;
  }
  if (decodedSec < 0.2) throw refuse('the file holds no audio');
  if (declared > 1 && decodedSec < 0.9 * declared) {
    throw refuse(
      `the file is cut short: its header promises ${declared.toFixed(1)} s but it holds ${decodedSec.toFixed(1)} s`,
    );
  }
  if (decodedSec > maxDurationSec) {
    throw refuse(`the recording is longer than the limit of ${Math.round(maxDurationSec / 60)} minutes`, 413);
  }
  return { format, mimeType: MIME[format], durationSec: Math.round(decodedSec * 1000) / 1000 };
}

/** A RIFF/WAVE file's data chunk must hold the bytes its header promises. */
async function checkWavData(file: string, size: number): Promise<void> {
  const fd = await fs.promises.open(file, 'r');
  try {
    const head = Buffer.alloc(Math.min(size, 1 << 16));
    await fd.read(head, 0, head.length, 0);
    let at = 12; // after "RIFF", size, "WAVE"
    while (at + 8 <= head.length) {
      const id = head.toString('latin1', at, at + 4);
      const length = head.readUInt32LE(at + 4);
      if (id === 'data') {
        const available = size - (at + 8);
        // 0xFFFFFFFF (and 0) mark a stream written without knowing its length: nothing is promised.
        if (length !== 0xffffffff && length !== 0 && length > available) {
          throw refuse(`the file is cut short: its header promises ${length} bytes of audio but it holds ${available}`);
        }
        return;
      }
      at += 8 + length + (length % 2);
    }
  } finally {
    await fd.close();
  }
}
