// Metronome marks and tempo-marking names: the guides a musician already knows from the instrument.

/**
 * The scale of a traditional mechanical (Maelzel-pattern) metronome, 40 to 208: steps of 2 up to 60, of 3
 * to 72, of 4 to 120, of 6 to 144 and of 8 to 208. Source: the scale engraved on such metronomes (from
 * memory; it is also tabulated in the article "Metronome" of The New Grove Dictionary of Music).
 */
export const METRONOME_MARKS: readonly number[] = [
  40, 42, 44, 46, 48, 50, 52, 54, 56, 58, 60, 63, 66, 69, 72, 76, 80, 84, 88, 92, 96, 100, 104, 108, 112, 116, 120, 126,
  132, 138, 144, 152, 160, 168, 176, 184, 192, 200, 208,
];

/** The next mark strictly above `bpm` (the top mark stays the top mark). */
export function nextMarkUp(bpm: number): number {
  return METRONOME_MARKS.find((m) => m > bpm + 1e-9) ?? METRONOME_MARKS[METRONOME_MARKS.length - 1]!;
}

/** The next mark strictly below `bpm` (the bottom mark stays the bottom mark). */
export function nextMarkDown(bpm: number): number {
  for (let i = METRONOME_MARKS.length - 1; i >= 0; i--)
    if (METRONOME_MARKS[i]! < bpm - 1e-9) return METRONOME_MARKS[i]!;
  return METRONOME_MARKS[0]!;
}

/** The mark nearest to `bpm`. */
export const nearestMark = (bpm: number) =>
  METRONOME_MARKS.reduce((best, m) => (Math.abs(m - bpm) < Math.abs(best - bpm) ? m : best), METRONOME_MARKS[0]!);

export interface TempoMarking {
  name: string;
  meaning: string;
  lowBpm: number;
  highBpm: number;
}

/**
 * Italian tempo markings with the BPM ranges given for them in the list of the Wikipedia article "Tempo"
 * (section "Basic tempo markings"; values from memory). Sources disagree and the ranges overlap, so they are
 * guides to show side by side, never bins that decide a name.
 */
export const TEMPO_MARKINGS: readonly TempoMarking[] = [
  { name: 'Grave', meaning: 'very slow, solemn', lowBpm: 25, highBpm: 45 },
  { name: 'Largo', meaning: 'broadly', lowBpm: 40, highBpm: 60 },
  { name: 'Lento', meaning: 'slowly', lowBpm: 45, highBpm: 60 },
  { name: 'Larghetto', meaning: 'rather broadly', lowBpm: 60, highBpm: 66 },
  { name: 'Adagio', meaning: 'at ease, slow', lowBpm: 66, highBpm: 76 },
  { name: 'Andante', meaning: 'at a walking pace', lowBpm: 76, highBpm: 108 },
  { name: 'Moderato', meaning: 'moderately', lowBpm: 108, highBpm: 120 },
  { name: 'Allegretto', meaning: 'moderately fast', lowBpm: 112, highBpm: 120 },
  { name: 'Allegro', meaning: 'fast, bright', lowBpm: 120, highBpm: 156 },
  { name: 'Vivace', meaning: 'lively and fast', lowBpm: 156, highBpm: 176 },
  { name: 'Presto', meaning: 'very fast', lowBpm: 168, highBpm: 200 },
  { name: 'Prestissimo', meaning: 'extremely fast', lowBpm: 200, highBpm: 240 },
];

/** Every marking whose range holds `bpm` (often two: the ranges overlap). */
export const markingsFor = (bpm: number) => TEMPO_MARKINGS.filter((m) => bpm >= m.lowBpm && bpm <= m.highBpm);
