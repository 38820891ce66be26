// The tempo engine: samples in, analysis out. Each stage is one function in its own file, called here in
// the order the signal flows: onset → periodicity → tempo → metrical level → beats → meter → curve → summary.
import type { Analysis } from '@/shared/analysis';
import { onsetEnvelope, type OnsetEnvelope } from './onset';
import {
  bpmToLag,
  globalPeriodicity,
  localPulse,
  localTempogram,
  trackPeriod,
  MIN_BPM,
  MAX_BPM,
  type PeriodicityCurve,
} from './periodicity';
import { estimateTempo, relationTo, type TempoEstimate } from './tempo';
import { round } from './numbers';
import { beatsWithOffBeatBass, trackBeats } from './beats';
import { estimateMeter } from './meter';
import { regressionBpm, summarise, tempoCurve, interBeatTempi, median } from './curve';
import { ANALYSIS_RATE, resample } from './resample';
import { chooseLevel, levelCandidates, LEVEL_MAX_BPM, type LevelCandidate, type LevelModel } from './level';
import { LEVEL_MODEL } from './level-weights';
import { loadSpectrum } from './spectrum';

const TEMPO_PATH_RANGE = 1.32;
/** Beat-to-beat tempo varying less than this (coefficient of variation) counts as a steady piece. */
const STEADY_CV = 0.03;
/**
 * Measured on synthetic click tracks (exact click times): the flux peak of a Hann-windowed frame comes about
 * 13 ms before the attack's sample position at this frame size, so beat times are moved later by that much.
 */
const ONSET_LATENCY_SEC = -0.013;

export interface AnalyseOptions {
  /** The metrical-level model; the shipped one (level-weights.ts) unless given (cross-validation). */
  levelModel?: LevelModel;
}

/** The whole analysis of a mono signal. Asynchronous only for loading the FFT (spectrum.ts) the first time. */
export async function analyse(
  samples: Float32Array,
  sampleRate: number,
  options: AnalyseOptions = {},
): Promise<Analysis> {
  const started = performance.now();
  await loadSpectrum();
  const durationSec = samples.length / sampleRate;
  const env = envelopeOf(samples, sampleRate);
  const fr = env.frameRate;
  const empty: Analysis = {
    bpm: null,
    confidence: 0,
    candidates: [],
    beats: [],
    downbeats: [],
    meter: null,
    curve: [],
    startBpm: null,
    endBpm: null,
    driftPct: null,
    stabilityCv: null,
    beatCount: 0,
    levelAmbiguous: false,
    levels: [],
    durationSec: round(durationSec, 3),
    analysisMs: 0,
  };
  const finish = (a: Analysis) => ({ ...a, analysisMs: Math.round(performance.now() - started) });

  // Nothing moves at all (silence, or too short to hold two beats at the slowest tempo).
  let energy = 0;
  for (let i = 0; i < env.strength.length; i++) energy += env.strength[i]!;
  if (energy < 1e-3 || env.strength.length < bpmToLag(MIN_BPM, fr) * 2) return finish(empty);

  const { periodicity, tempo } = ruleBasedTempo(env);
  if (!tempo) return finish(empty);
  const levelModel = options.levelModel ?? LEVEL_MODEL;
  const level = chooseLevel(levelCandidates(periodicity, env, tempo.bpm), levelModel);
  const modelBpm = level?.bpm ?? tempo.bpm;

  const tracked = trackGrid(env, modelBpm);
  // The bass between the beats may say the beat is twice as fast (beats.ts), within the range of a beat.
  const withOffBeats = 2 * modelBpm <= LEVEL_MAX_BPM ? beatsWithOffBeatBass(tracked, env.strength, env.low) : null;
  const beatFrames = withOffBeats ?? tracked;
  const globalBpm = withOffBeats ? 2 * modelBpm : modelBpm;
  const toSec = (f: number) => f / fr + env.offsetSec - ONSET_LATENCY_SEC;
  const beats = beatFrames.map((f) => round(Math.max(0, toSec(f)), 4));
  const summary = summarise(beats);
  const meter = estimateMeter(beatFrames, env.low, env.strength);
  const downbeats = meter
    ? beats.filter((_, i) => i >= meter.phase && (i - meter.phase) % meter.beatsPerBar === 0)
    : [];

  // Steady pieces: the regression through all beats gives sub-BPM precision; otherwise the median beat tempo.
  const steady = summary !== null && summary.stabilityCv < STEADY_CV && Math.abs(summary.driftPct) < 3;
  const fromBeats = steady
    ? regressionBpm(beats)
    : beats.length > 2
      ? median(interBeatTempi(beats).map((x) => x.bpm))
      : null;
  const bpm = fromBeats && Math.abs(fromBeats / globalBpm - 1) < 0.5 ? fromBeats : globalBpm;

  // The chosen tempo first, then the other periodicity peaks named by their relation to it.
  const chosenScore = tempo.candidates.find((c) => Math.abs(c.bpm / globalBpm - 1) <= 0.04)?.score ?? 0;
  const candidates = [
    { bpm: round(bpm, 1), score: chosenScore, relation: 'primary' as const },
    ...tempo.candidates
      .filter((c) => Math.abs(c.bpm / globalBpm - 1) > 0.04)
      .map((c) => ({ ...c, relation: relationTo(c.bpm, bpm) })),
  ];
  return finish({
    bpm: round(bpm, 2),
    confidence: round(confidenceFrom(tempo.strength, summary?.stabilityCv ?? 1), 3),
    candidates,
    beats,
    downbeats,
    meter: meter ? `${meter.beatsPerBar}/4` : null,
    curve: tempoCurve(beats),
    startBpm: summary?.startBpm ?? null,
    endBpm: summary?.endBpm ?? null,
    driftPct: summary?.driftPct ?? null,
    stabilityCv: summary?.stabilityCv ?? null,
    beatCount: beats.length,
    levelAmbiguous: level?.ambiguous ?? false,
    levels: withOffBeats && level ? doubledLevels(level.levels, globalBpm) : (level?.levels ?? []),
    durationSec: round(durationSec, 3),
    analysisMs: 0,
  });
}

/**
 * The rule-based tempo (tempo.ts) of an onset envelope, with the periodicity it was read from. Both are read
 * from attacks and harmonic changes together (onset.ts `tempoNovelty`), so music that marks its beats by
 * chord changes has its tempo among the candidates. The metrical-level features stay on the attacks, where
 * the bass, the backbeat and the weaker off-beats are heard (a chord change is as loud on a soft off-beat
 * click as on a strong one, which would hide that the off-beats are weaker).
 */
function ruleBasedTempo(env: OnsetEnvelope): { periodicity: PeriodicityCurve; tempo: TempoEstimate | null } {
  const fr = env.frameRate;
  const periodicity = globalPeriodicity(env.tempoNovelty, fr);
  const pulseIn = (x: Float32Array) => (b: number) => localPulse(x, fr, b);
  return { periodicity, tempo: estimateTempo(periodicity, pulseIn(env.tempoNovelty), pulseIn(env.low)) };
}

/**
 * Beat frames at one metrical level: the tempo followed over time within ±32 % of the level's period (a
 * ritardando of a quarter, a ramp from 90 to 130), which keeps the grid on its level (×4/3 and ×3/2 pulses
 * lie outside it), then the dynamic-programming beat tracker along that path.
 */
function trackGrid(env: OnsetEnvelope, bpm: number): number[] {
  const fr = env.frameRate;
  const lag0 = bpmToLag(bpm, fr);
  const minLag = Math.max(2, Math.floor(Math.max(bpmToLag(MAX_BPM, fr), lag0 / TEMPO_PATH_RANGE)));
  const maxLag = Math.ceil(Math.min(bpmToLag(MIN_BPM, fr), lag0 * TEMPO_PATH_RANGE));
  const tg = localTempogram(env.strength, fr, minLag, maxLag);
  const path = trackPeriod(tg, lag0);
  const periodAt = new Float32Array(env.strength.length);
  for (let i = 0, w = 0; i < periodAt.length; i++) {
    while (w < tg.centres.length - 1 && tg.centres[w + 1]! <= i) w++;
    const a = tg.centres[w]!;
    const b = tg.centres[Math.min(w + 1, tg.centres.length - 1)]!;
    const f = b > a ? Math.max(0, Math.min(1, (i - a) / (b - a))) : 0;
    periodAt[i] = path[w]! * (1 - f) + path[Math.min(w + 1, path.length - 1)]! * f;
  }
  return trackBeats(env.strength, periodAt);
}

function envelopeOf(samples: Float32Array, sampleRate: number): OnsetEnvelope {
  const audio = sampleRate === ANALYSIS_RATE ? samples : resample(samples, sampleRate, ANALYSIS_RATE);
  return onsetEnvelope(audio, ANALYSIS_RATE);
}

/** The metrical-level candidates of a recording with their features, for fitting the level model. */
export async function levelCandidatesOf(samples: Float32Array, sampleRate: number): Promise<LevelCandidate[]> {
  await loadSpectrum();
  const env = envelopeOf(samples, sampleRate);
  if (env.strength.length < bpmToLag(MIN_BPM, env.frameRate) * 2) return [];
  const { periodicity, tempo } = ruleBasedTempo(env);
  return tempo ? levelCandidates(periodicity, env, tempo.bpm) : [];
}

/** The doubled grid's tempo first (with the model's probability for it, 0 when it was no candidate), then the model's choice. */
function doubledLevels(levels: { bpm: number; strength: number }[], bpm: number): { bpm: number; strength: number }[] {
  const own = levels.find((l) => relationTo(l.bpm, bpm) === 'primary');
  return [{ bpm: round(bpm, 1), strength: own?.strength ?? 0 }, levels[0]!];
}

/** Periodicity strength, discounted when the beats wander: both must hold for a confident answer. */
function confidenceFrom(strength: number, cv: number): number {
  const periodic = Math.max(0, Math.min(1, (strength - 0.05) / 0.45));
  const regular = Math.max(0, Math.min(1, 1 - cv / 0.25));
  return periodic * (0.5 + 0.5 * regular);
}
