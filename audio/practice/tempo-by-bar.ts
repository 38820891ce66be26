// Tempo per bar from an analysis's beat grid, and its smoothing over a window of bars: what the tempo curve,
// the steadiness report and the practice charts plot. Bars are numbered as the player numbers them
// (`passage.ts`): bar 1 starts at the first downbeat; the pickup before it (bar 0) has no bar tempo.
import { barAt, barBoundaries, type Grid } from './passage';

export interface BarTempo {
  /** 1-based, as the player shows it. */
  bar: number;
  /** Seconds from the start of the recording (the bar's downbeat). */
  start: number;
  /** Beats counted in the bar. */
  beats: number;
  bpm: number;
}

/**
 * Each bar's tempo: beats in the bar × 60 / the bar's duration (downbeat to next downbeat). The last bar has no
 * next downbeat, so its duration is unknown (the recording may stop mid-bar or ring on): it is measured over its
 * own beats instead, (beats − 1) intervals × 60 / first-to-last beat, which is the same number on a steady grid.
 * Bars with fewer than two beats and no next downbeat carry no tempo and are left out.
 */
export function tempoByBar(grid: Grid): BarTempo[] {
  const { beats, downbeats } = grid;
  if (beats.length < 2 || downbeats.length === 0) return [];
  const bounds = barBoundaries(grid);
  const beatsIn: number[][] = downbeats.map(() => []);
  for (const b of beats) {
    const bar = barAt(b, downbeats);
    if (bar > 0) beatsIn[bar - 1]!.push(b);
  }
  const out: BarTempo[] = [];
  downbeats.forEach((start, i) => {
    const inBar = beatsIn[i]!;
    const isLast = i === downbeats.length - 1;
    if (!isLast) {
      const duration = bounds[i + 1]! - start;
      if (inBar.length > 0 && duration > 0)
        out.push({ bar: i + 1, start, beats: inBar.length, bpm: (inBar.length * 60) / duration });
    } else if (inBar.length >= 2) {
      const span = inBar[inBar.length - 1]! - inBar[0]!;
      if (span > 0) out.push({ bar: i + 1, start, beats: inBar.length, bpm: ((inBar.length - 1) * 60) / span });
    }
  });
  return out;
}

/**
 * A centred moving median over `windowBars` bars (an even window is widened by one so it stays centred; near the
 * ends the window shrinks to the bars there are). A median rather than a mean: one mis-tracked bar (a slipped
 * downbeat reads as a bar at half or double speed) leaves it untouched instead of pulling its neighbours, and a
 * real change of tempo stays a step instead of being smeared over the window.
 */
export function smoothTempo(bars: BarTempo[], windowBars: number): BarTempo[] {
  const half = Math.max(0, Math.floor(windowBars / 2));
  return bars.map((b, i) => {
    const from = Math.max(0, i - half);
    const window = bars.slice(from, Math.min(bars.length, i + half + 1)).map((w) => w.bpm);
    return { ...b, bpm: median(window) };
  });
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const mid = Math.floor(s.length / 2);
  return s.length % 2 ? s[mid]! : (s[mid - 1]! + s[mid]!) / 2;
}
