// Latency calibration: the round trip from a click leaving the audio clock to its sound arriving back through
// the microphone (output buffer, speaker or headphone, air, input buffer). The player plays a few clicks into
// the microphone (or taps along); the median offset of the onsets to their clicks is the latency, and recorded
// takes and live marks are shifted by it. Pure: fed onset and click times.
import { nearestClick, type ClickGrid } from './feedback';

/** Clicks of a calibration run after its one-bar lead-in. */
export const CALIBRATION_CLICKS = 8;
/** Fewer onsets matched to clicks than this and the run proves nothing. */
export const MIN_CALIBRATION_ONSETS = 5;
/**
 * Above this spread (median absolute deviation of the offsets) the onsets are not the clicks coming back (or a
 * very uneven tapping): the run is refused. Tapping along spreads some 10–20 ms (common practice), so 30 ms.
 */
export const MAX_SPREAD_MS = 30;

export interface Calibration {
  /** Median onset minus click, ms. */
  latencyMs: number;
  /** Median absolute deviation of the offsets, ms. */
  spreadMs: number;
  /** Onsets that counted. */
  used: number;
}

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
};

export type CalibrationResult = { ok: true; calibration: Calibration } | { ok: false; reason: string };

/** The latency from the onsets heard during the clicks from beat `fromBeat` on (the first onset per beat counts). */
export function calibrate(onsets: number[], grid: ClickGrid, fromBeat: number): CalibrationResult {
  const byBeat = new Map<number, number>();
  for (const t of onsets) {
    const { beat, offsetMs } = nearestClick(t, grid);
    if (beat >= fromBeat && !byBeat.has(beat)) byBeat.set(beat, offsetMs);
  }
  const offsets = [...byBeat.values()];
  if (offsets.length < MIN_CALIBRATION_ONSETS)
    return {
      ok: false,
      reason: `Only ${offsets.length} of the clicks came back through the microphone. Turn the click up a little, hold the microphone nearer, or tap along on something you can hear.`,
    };
  const latencyMs = median(offsets);
  const spreadMs = median(offsets.map((o) => Math.abs(o - latencyMs)));
  if (spreadMs > MAX_SPREAD_MS)
    return {
      ok: false,
      reason: 'The sounds came back too unevenly to measure. Try again in a quieter room, or tap more evenly.',
    };
  return { ok: true, calibration: { latencyMs, spreadMs, used: offsets.length } };
}
