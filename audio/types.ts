// What the tempo engine reports. Plain data: the server stores it, the client draws it.

export type TempoRelation =
  | 'primary'
  | 'half'
  | 'double'
  | 'triple'
  | 'third'
  | 'quadruple'
  | 'quarter'
  /** ×3/2: the other tempo's beat is a dotted note of this one. */
  | 'three-halves'
  /** ×2/3: this tempo's beat is a dotted note of the primary one. */
  | 'two-thirds'
  | 'unrelated';

export interface TempoCandidate {
  bpm: number;
  /** Periodicity strength relative to the best candidate (1 for the best). */
  score: number;
  relation: TempoRelation;
}

export interface CurvePoint {
  /** Seconds from the start of the recording. */
  t: number;
  bpm: number;
}

export interface Analysis {
  /** Global tempo; null when no beat could be found (silence, a single sound). */
  bpm: number | null;
  /** 0 (no periodic pulse) … 1 (an unmistakable steady beat). */
  confidence: number;
  candidates: TempoCandidate[];
  beats: number[];
  downbeats: number[];
  /** e.g. "4/4", "3/4"; null without beats. */
  meter: string | null;
  curve: CurvePoint[];
  startBpm: number | null;
  endBpm: number | null;
  /** (end − start) / start, in percent. */
  driftPct: number | null;
  /** Coefficient of variation of beat-to-beat tempo (0 = perfectly steady). */
  stabilityCv: number | null;
  beatCount: number;
  durationSec: number;
  analysisMs: number;
}
