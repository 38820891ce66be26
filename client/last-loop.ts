// The last loop on each recording, kept in the browser (localStorage) so a reload finds it again. It is the
// player's working state on this device, not the song's: saved passages are what the server keeps.
import type { Passage } from '@/audio/practice/passage';

const key = (recordingId: string) => `tactus.loop.${recordingId}`;

function storage(): Storage | null {
  try {
    return typeof window !== 'undefined' && window.localStorage ? window.localStorage : null;
  } catch {
    // Storage can be refused (private modes, blocked cookies): the loop is then simply not kept.
    return null;
  }
}

export function readLastLoop(recordingId: string): Passage | null {
  try {
    const v = JSON.parse(storage()?.getItem(key(recordingId)) ?? 'null') as Passage | null;
    return v && Number.isFinite(v.start) && Number.isFinite(v.end) && v.end > v.start
      ? { start: v.start, end: v.end }
      : null;
  } catch {
    return null;
  }
}

export function keepLastLoop(recordingId: string, loop: Passage | null) {
  const s = storage();
  if (!s) return;
  if (loop) s.setItem(key(recordingId), JSON.stringify({ start: loop.start, end: loop.end }));
  else s.removeItem(key(recordingId));
}
