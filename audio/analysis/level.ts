// Stage 3b — the metrical level: which of the periodicity peaks is the beat a player taps (and not its half,
// double or a dotted relative). Each candidate tempo is described by a few features and scored by a
// conditional logit (a softmax over the candidates of one recording, McFadden 1974) with weights fitted by
// fixtures/train-level.ts; the features follow the literature on the metrical-level ("octave") decision:
// a tempo prior on log-tempo (Moelants & McKinney 2004: tapped tempi cluster around 120 BPM, ~0.5–1 octave
// wide), periodicity strength from a comb over the autocorrelation (Scheirer 1998; Ellis 2007), the pulse
// of the bass band (Klapuri, Eronen & Astola 2006 weight low-register accents for the beat level), whether
// the level carries a subdivision (tempogram ratio features, Peeters 2007 / Böck et al. 2015), and the beat
// rate relative to the rate of onsets (Gouyon et al. 2006 / Hockman & Fujinaga 2010: onset density
// informs the octave choice), and the backbeat — bass-drum accents answered one beat later by snare-like
// accents above the bass (Goto 2001 finds the beat level of popular music from exactly this alternation).
import { round } from './numbers';
import type { PeriodicityCurve } from './periodicity';
import { localPulse } from './periodicity';
import { relationTo } from './tempo';
import type { OnsetEnvelope } from './onset';

/** The range in which a candidate may be called the beat: Largo to Presto in common practice, and the span
 * of tapped tempi in Moelants & McKinney 2004 (about 40–240 BPM). */
export const LEVEL_MIN_BPM = 40;
export const LEVEL_MAX_BPM = 240;
/** Candidates compared per recording: enough to hold the half, double and dotted relatives of the top peaks. */
const MAX_CANDIDATES = 8;
/**
 * The model overrules the rule-based estimate only with odds beyond 3 : 1 (a conventional "substantial
 * evidence" bound, Jeffreys 1961).
 */
const DECISIVE_ODDS = 3;
/** Two levels are a close call, offered both, when the model's odds between them are 2 : 1 or closer. */
const AMBIGUOUS_ODDS = 2;
/**
 * A slower level whose beats do not stand out from the faster pulse at all (the faster pulse at twice its
 * tempo is this strong or more, relative) is no level of its own: a plain click track at 120 has no 60.
 */
const SAME_AS_FASTER = 0.97;
/** Two peaks closer than this are one candidate (the 4 % of Accuracy1, Gouyon et al. 2006). */
const SAME_TEMPO = 0.04;

export const LEVEL_FEATURES = [
  /** log2(bpm / 120): the prior on tempo, learned as a quadratic in log-tempo (a log-Gaussian). */
  'logTempo',
  'logTempoSquared',
  /** Comb-filtered periodicity at this tempo, relative to the best candidate's. */
  'comb',
  /** Windowed (8 s) pulse strength at this tempo, relative to the best candidate's. */
  'pulse',
  /** The same for the bass band (below 150 Hz). */
  'bassPulse',
  /** Pulse at twice this tempo over the pulse at this tempo: a level with a subdivision under it. */
  'subdivision',
  /** log2(beats per second / onsets per second): 0 when every onset is a beat, −1 when two onsets a beat. */
  'beatsPerOnset',
  'beatsPerOnsetSquared',
  /** Bass accents answered by upper-band accents one beat later (kick on 1 and 3, snare on 2 and 4). */
  'backbeat',
] as const;

export interface LevelModel {
  /** One weight per feature in LEVEL_FEATURES order, applied to standardised features. */
  weights: number[];
  /** Standardisation fitted with the weights: feature means and standard deviations. */
  mean: number[];
  scale: number[];
}

export interface LevelCandidate {
  bpm: number;
  features: number[];
  /** The tempo the rule-based estimate picked (tempo.ts). */
  ruleBased: boolean;
}

/** Onsets per second: local maxima of the envelope (±50 ms, the shortest gap between two heard attacks in
 * common practice) above its mean. */
export function onsetRate(envelope: Float32Array, frameRate: number): number {
  const n = envelope.length;
  if (n < 3) return 0;
  let mean = 0;
  for (let i = 0; i < n; i++) mean += envelope[i]!;
  mean /= n;
  const half = Math.max(1, Math.round(0.05 * frameRate));
  let count = 0;
  for (let i = 0; i < n; i++) {
    const v = envelope[i]!;
    if (v <= mean) continue;
    let isMax = true;
    for (let d = -half; d <= half && isMax; d++) if (d !== 0 && (envelope[i + d] ?? 0) > v) isMax = false;
    if (isMax) count++;
  }
  return count / (n / frameRate);
}

/** The candidate tempos of a recording and their features (in LEVEL_FEATURES order). */
export function levelCandidates(curve: PeriodicityCurve, env: OnsetEnvelope, ruleBasedBpm: number): LevelCandidate[] {
  const { strength, low, upper } = env;
  const { bpm, score, frameRate } = curve;
  const peaks: number[] = [];
  for (let i = 1; i < score.length - 1; i++) {
    if (bpm[i]! < LEVEL_MIN_BPM || bpm[i]! > LEVEL_MAX_BPM) continue;
    if (score[i]! > score[i - 1]! && score[i]! >= score[i + 1]! && score[i]! > 0) peaks.push(i);
  }
  peaks.sort((a, b) => score[b]! - score[a]!);
  const chosen: number[] = [];
  for (const i of peaks) {
    if (chosen.length >= MAX_CANDIDATES) break;
    if (chosen.every((j) => Math.abs(bpm[j]! / bpm[i]! - 1) > SAME_TEMPO)) chosen.push(i);
  }
  if (!chosen.length) return [];
  const rate = Math.max(0.1, onsetRate(strength, frameRate));
  const raw = chosen.map((i) => {
    const b = bpm[i]!;
    const pulse = localPulse(strength, frameRate, b);
    const bass = localPulse(low, frameRate, b);
    // Duple or triple (swing, compound metre) subdivision, whichever is stronger.
    const ratio = (x: Float32Array, own: number) =>
      Math.min(2, Math.max(localPulse(x, frameRate, 2 * b), localPulse(x, frameRate, 3 * b)) / Math.max(1e-6, own));
    return {
      bpm: b,
      comb: score[i]!,
      pulse,
      bass,
      sub: ratio(strength, pulse),
      back: crossPulse(low, upper, frameRate, b),
    };
  });
  const top = (pick: (r: (typeof raw)[number]) => number) => Math.max(1e-6, ...raw.map(pick));
  const combTop = top((r) => r.comb);
  const pulseTop = top((r) => r.pulse);
  const bassTop = top((r) => r.bass);
  const backTop = top((r) => r.back);
  return raw.map((r) => {
    const x = Math.log2(r.bpm / 120);
    const d = Math.log2(r.bpm / 60 / rate);
    return {
      bpm: r.bpm,
      features: [x, x * x, r.comb / combTop, r.pulse / pulseTop, r.bass / bassTop, r.sub, d, d * d, r.back / backTop],
      ruleBased: Math.abs(r.bpm / ruleBasedBpm - 1) <= SAME_TEMPO,
    };
  });
}

/**
 * How strongly accents of \`a\` are followed by accents of \`b\` one period later: the best normalised
 * cross-correlation within ±3 % of the period's lag (as localPulse, over the whole recording).
 */
export function crossPulse(a: Float32Array, b: Float32Array, frameRate: number, bpm: number): number {
  const lag = (60 * frameRate) / bpm;
  const n = Math.min(a.length, b.length);
  let ea = 0;
  let eb = 0;
  for (let i = 0; i < n; i++) {
    ea += a[i]! * a[i]!;
    eb += b[i]! * b[i]!;
  }
  if (ea <= 0 || eb <= 0) return 0;
  let best = 0;
  for (let l = Math.max(1, Math.floor(lag * 0.97)); l <= Math.ceil(lag * 1.03) && l < n; l++) {
    let acc = 0;
    for (let i = 0; i + l < n; i++) acc += a[i]! * b[i + l]!;
    best = Math.max(best, (acc / Math.sqrt(ea * eb)) * (n / (n - l)));
  }
  return best;
}

/** The model's probability for each candidate (softmax of the linear scores). */
export function levelProbabilities(candidates: LevelCandidate[], model: LevelModel): number[] {
  const u = candidates.map((c) =>
    c.features.reduce((s, f, k) => s + (model.weights[k]! * (f - model.mean[k]!)) / model.scale[k]!, 0),
  );
  const m = Math.max(...u);
  const e = u.map((v) => Math.exp(v - m));
  const z = e.reduce((a, b) => a + b, 0);
  return e.map((v) => v / z);
}

export interface LevelChoice {
  bpm: number;
  ambiguous: boolean;
  /** The chosen level, then its rival at the half or double tempo if any, with the model's probabilities. */
  levels: { bpm: number; strength: number }[];
}

/**
 * The most probable candidate under the model. Where the rule-based estimate (tempo.ts: prior around 120 BPM
 * and the complete-pulse test, exact on our rendered corpus) picked a tempo at half, double, three times or a
 * third of it, the model overrules it only when decisive (odds beyond DECISIVE_ODDS): fitted on 70 clips,
 * the model knows little about styles it has not heard (fast swing, waltzes), where the rule holds.
 */
export function chooseLevel(cands: LevelCandidate[], model: LevelModel): LevelChoice | null {
  if (!cands.length) return null;
  const p = levelProbabilities(cands, model);
  let best = 0;
  for (let i = 1; i < cands.length; i++) if (p[i]! > p[best]!) best = i;
  const rule = cands.findIndex((c) => c.ruleBased);
  const relation = rule >= 0 ? relationTo(cands[best]!.bpm, cands[rule]!.bpm) : 'primary';
  // A third of a pulse that stays is the bar of a triple metre (a waltz's bar is not its beat): never taken.
  if (relation === 'third') best = rule;
  else if (['half', 'double', 'triple'].includes(relation) && p[best]! < DECISIVE_ODDS * p[rule]!) best = rule;
  const b = cands[best]!.bpm;
  let rival = -1;
  cands.forEach((c, i) => {
    const rel = relationTo(c.bpm, b);
    if ((rel === 'half' || rel === 'double') && (rival < 0 || p[i]! > p[rival]!)) rival = i;
  });
  const levels = [{ bpm: round(b, 1), strength: round(p[best]!, 3) }];
  if (rival >= 0) levels.push({ bpm: round(cands[rival]!.bpm, 1), strength: round(p[rival]!, 3) });
  const slower = rival >= 0 && cands[rival]!.bpm < b ? rival : best;
  const distinct = rival >= 0 && cands[slower]!.features[LEVEL_FEATURES.indexOf('subdivision')]! < SAME_AS_FASTER;
  return {
    bpm: b,
    ambiguous: distinct && Math.max(p[rival]!, p[best]!) <= AMBIGUOUS_ODDS * Math.min(p[rival]!, p[best]!),
    levels,
  };
}
