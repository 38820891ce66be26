// What the tempo engine reports: the one definition. The engine (audio/analysis/) returns this type, the
// server validates stored results against it when it reads them, and the client draws it.
import { z } from 'zod';

export const TEMPO_RELATIONS = [
  'primary',
  'half',
  'double',
  'triple',
  'third',
  'quadruple',
  'quarter',
  /** ×3/2: the other tempo's beat is a dotted note of this one. */
  'three-halves',
  /** ×2/3: this tempo's beat is a dotted note of the primary one. */
  'two-thirds',
  'unrelated',
] as const;
export const TempoRelationSchema = z.enum(TEMPO_RELATIONS);
export type TempoRelation = z.infer<typeof TempoRelationSchema>;

export const TempoCandidateSchema = z.object({
  bpm: z.number(),
  /** Periodicity strength relative to the best candidate (1 for the best). */
  score: z.number(),
  relation: TempoRelationSchema,
});
export type TempoCandidate = z.infer<typeof TempoCandidateSchema>;

export const CurvePointSchema = z.object({
  /** Seconds from the start of the recording. */
  t: z.number(),
  bpm: z.number(),
});
export type CurvePoint = z.infer<typeof CurvePointSchema>;

export const MetricalLevelSchema = z.object({
  bpm: z.number(),
  strength: z.number(),
});
export type MetricalLevel = z.infer<typeof MetricalLevelSchema>;

export const AnalysisSchema = z.object({
  /** Global tempo; null when no beat could be found (silence, a single sound). */
  bpm: z.number().nullable(),
  /** 0 (no periodic pulse) … 1 (an unmistakable steady beat). */
  confidence: z.number(),
  candidates: z.array(TempoCandidateSchema),
  beats: z.array(z.number()),
  downbeats: z.array(z.number()),
  /** e.g. "4/4", "3/4"; null without beats. */
  meter: z.string().nullable(),
  curve: z.array(CurvePointSchema),
  startBpm: z.number().nullable(),
  endBpm: z.number().nullable(),
  /** (end − start) / start, in percent. */
  driftPct: z.number().nullable(),
  /** Coefficient of variation of beat-to-beat tempo (0 = perfectly steady). */
  stabilityCv: z.number().nullable(),
  beatCount: z.number(),
  /**
   * True when the beat could as well be heard at the half or double tempo: the two metrical levels are
   * close, and the product should offer both (see `levels`). Absent in analyses by engine version 1.
   */
  levelAmbiguous: z.boolean().default(false),
  /**
   * The chosen metrical level first, then its rival at the half or double tempo when there is one; strength
   * is the level model's probability for each (0…1).
   */
  levels: z.array(MetricalLevelSchema).default([]),
  durationSec: z.number(),
  analysisMs: z.number(),
});
export type Analysis = z.infer<typeof AnalysisSchema>;
