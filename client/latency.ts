// The measured round trip from click to microphone, kept per browser (localStorage): it belongs to this
// device's speakers, headphones and microphone, not to the player's account.
import type { Calibration } from '@/audio/live/calibration';

const KEY = 'tactus.inputLatency';

export interface StoredCalibration extends Calibration {
  /** When it was measured (ISO). */
  at: string;
}

function storage(): Storage | null {
  try {
    return typeof window !== 'undefined' && window.localStorage ? window.localStorage : null;
  } catch {
    // Storage can be refused (private modes): the measurement then lasts as long as the page.
    return null;
  }
}

let inMemory: StoredCalibration | null = null;

export function readCalibration(): StoredCalibration | null {
  try {
    const v = JSON.parse(storage()?.getItem(KEY) ?? 'null') as StoredCalibration | null;
    return v && Number.isFinite(v.latencyMs) && Number.isFinite(v.spreadMs) ? v : inMemory;
  } catch {
    return inMemory;
  }
}

export function keepCalibration(c: Calibration): StoredCalibration {
  const stored = { ...c, at: new Date().toISOString() };
  inMemory = stored;
  storage()?.setItem(KEY, JSON.stringify(stored));
  return stored;
}
