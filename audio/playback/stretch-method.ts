// The player's two stretch methods behind one choice (a person's preference, shared/schemas.ts StretchMethod):
// the phase vocoder (signalsmith-stretch, audio/playback/signalsmith.ts) and SoundTouch's overlap-add with our
// settings (audio/playback/stretch.ts). Figures from `npm run bench:stretch`, quoted in the README.
import { heardOffsetSec, Stretcher, type MakeStretcher } from './stretch';
import { SignalsmithEngine, SignalsmithStretcher } from './signalsmith';
import type { StretchMethod } from '@/shared/schemas';

export const DEFAULT_STRETCH_METHOD: StretchMethod = 'phase-vocoder';

/**
 * Where a method's stretched attacks sit against the playback timeline at `speed` (seconds; negative = early), so
 * the click can follow the music. The phase vocoder's land within 2 ms of it at every speed the bench tries
 * (0.5× to 2×), so its click needs no shift.
 */
export function heardOffsetFor(method: StretchMethod, speed: number): number {
  return method === 'overlap-add' ? heardOffsetSec(speed) : 0;
}

/**
 * The maker of stretchers for `method`. The phase vocoder's WebAssembly module is built first (asynchronous), one
 * per player: its stretchers take turns on it, one running at a time, as LivePlayback uses them.
 */
export async function stretcherMaker(method: StretchMethod, sampleRate: number): Promise<MakeStretcher> {
  if (method === 'overlap-add') return (source, tempo) => new Stretcher(source, tempo, sampleRate);
  const engine = await SignalsmithEngine.create(sampleRate);
  return (source, tempo) => new SignalsmithStretcher(engine, source, tempo);
}
