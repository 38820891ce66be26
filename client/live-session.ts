// Recording against the click, in the browser: the microphone (getUserMedia) goes into the capture worklet
// (audio/live/worklet/capture-processor.ts) on the page's one AudioContext, the same context that plays the
// click, so onsets, recorded samples and clicks share one clock. A run is a one-bar count-in then clicks at the
// chosen tempo; onsets become beat marks (audio/live/feedback.ts) as they are played. A calibration run plays a
// few clicks and measures the round trip (audio/live/calibration.ts). A play-along run (`startAlong`) opens the
// microphone only: the caller plays the reference and keeps the grid of its beats. Nothing leaves the browser
// here: a kept take is uploaded by the caller.
import { MetronomeTimeline } from '@/audio/playback/click';
import { LiveFeedback, type BeatMark, type TargetGrid } from '@/audio/live/feedback';
import { calibrate, CALIBRATION_CLICKS, type CalibrationResult } from '@/audio/live/calibration';
import type { FromCapture, ToCapture } from '@/audio/live/capture-host';
import { assembleTake, type CapturedChunk } from '@/audio/live/take';
import { addWorkletModule, resumeAudio } from './audio-context';
import { ClickScheduler } from './click-scheduler';

const WORKLET_URL = `${process.env.EXPO_BASE_URL ?? ''}/capture-processor.js`;
/**
 * The count-in starts this long after the microphone's first sound reaches the worklet: time for the message
 * to reach the page and the first click to be scheduled, so nothing of the count-in is missed.
 */
const START_MARGIN_SEC = 0.25;
/**
 * Play-along's music starts this long after the microphone's first sound: besides the message to the page, the
 * player's start must be scheduled, and it cannot start earlier than asked; asked in time, the music's beats sit
 * where the caller said (a page busy for half a second would start it late; the feedback still follows the real
 * start, as the beats come from the player).
 */
export const ALONG_MARGIN_SEC = 0.5;
/** The take begins this fraction of a beat before the first beat after the count-in: an early first note is kept. */
const LEAD_BEATS = 0.5;

export type MicProblem = 'denied' | 'no-device' | 'unsupported' | 'busy';

/** Why the microphone could not be used, in plain words for the screen. */
export class MicrophoneError extends Error {
  constructor(
    readonly problem: MicProblem,
    message: string,
  ) {
    super(message);
  }
}

function micError(e: unknown): MicrophoneError {
  const name = (e as { name?: string })?.name ?? '';
  if (name === 'NotAllowedError' || name === 'SecurityError')
    return new MicrophoneError(
      'denied',
      'Tactus may not use the microphone. Allow it in the browser’s site settings (the icon beside the address), then try again. Everything else on this page works without it.',
    );
  if (name === 'NotFoundError' || name === 'OverconstrainedError')
    return new MicrophoneError(
      'no-device',
      'No microphone was found. Plug one in (or choose one in the system settings) and try again.',
    );
  if (name === 'NotReadableError' || name === 'AbortError')
    return new MicrophoneError(
      'busy',
      'The microphone is in use by another program or could not be started. Close the other program and try again.',
    );
  return new MicrophoneError(
    'unsupported',
    'This browser cannot record here. Try a current Chrome, Firefox or Safari.',
  );
}

export interface RunOptions {
  bpm: number;
  beatsPerBar: number;
  /** Click level, 0…1. */
  clickVolume: number;
  /** The measured round trip, seconds (0 before calibration). */
  latencySec: number;
  /** A calibration run stops by itself after its clicks. */
  calibration?: boolean;
}

export interface RecordedTake {
  samples: Float32Array;
  sampleRate: number;
  seconds: number;
}

export interface LiveEvents {
  /** Input peak level 0…1, about twenty times a second. */
  level?: (peak: number) => void;
  /** A beat played (not for calibration runs). */
  mark?: (mark: BeatMark, onset: { time: number; receivedAt: number }) => void;
  /** The click grid is set: beat 0 (the first count-in click) sounds at context time `start`. */
  started?: (grid: { start: number; countIn: number }) => void;
  /** The capture worklet's own time figures, sent as a run ends (for the benchmark). */
  stats?: (s: Extract<FromCapture, { type: 'stats' }>) => void;
  /** A calibration run finished by itself. */
  calibrated?: (result: CalibrationResult) => void;
}

export class LiveSession {
  private stream: MediaStream | null = null;
  private source: MediaStreamAudioSourceNode | null = null;
  private node: AudioWorkletNode | null = null;
  private gain: GainNode | null = null;
  private clicks: ClickScheduler | null = null;
  private chunks: CapturedChunk[] = [];
  private onsets: number[] = [];
  private feedback: LiveFeedback | null = null;
  private takeFrom = 0;
  private ctx: AudioContext | null = null;
  private stopped: (() => void) | null = null;
  private calibrationTimer: ReturnType<typeof setTimeout> | null = null;
  private latencySec = 0;
  private disposed = false;
  running = false;

  constructor(private readonly events: LiveEvents = {}) {}

  /** Opens the microphone and starts the count-in; rejects with a MicrophoneError the screen can show. */
  async start(o: RunOptions): Promise<void> {
    if (this.running) return;
    const opened = await this.openMicrophone();
    if (!opened) return;
    const { ctx, firstInput } = opened;
    this.latencySec = o.latencySec;

    // The grid starts from the microphone's first sound (not its first block, which a device may fill with
    // zeros while it wakes), so the count-in is never cut short by a slow device.
    const start = Math.max((await firstInput) + START_MARGIN_SEC, ctx.currentTime + 0.1);
    const period = 60 / o.bpm;
    const grid = { start, bpm: o.bpm };
    this.feedback = o.calibration ? null : new LiveFeedback(grid, o.beatsPerBar);
    this.takeFrom = start + (o.beatsPerBar - LEAD_BEATS) * period;
    this.post({ type: 'record', from: start - 0.5 });
    this.gain = ctx.createGain();
    this.gain.gain.value = o.clickVolume;
    this.gain.connect(ctx.destination);
    const timeline = new MetronomeTimeline(start, o.bpm, o.beatsPerBar);
    const last = o.calibration ? start + (o.beatsPerBar + CALIBRATION_CLICKS - 0.5) * period : Infinity;
    this.clicks = new ClickScheduler(ctx, this.gain, (from, until) =>
      timeline.clicksBetween(from, Math.min(until, last)),
    );
    this.clicks.start(start);
    this.events.started?.({ start, countIn: o.beatsPerBar });
    if (o.calibration) {
      // Stop once the last click has had time to come back (half a beat after it).
      const waitMs = (last + period - ctx.currentTime) * 1000;
      this.calibrationTimer = setTimeout(() => {
        const onsets = [...this.onsets];
        void this.finish().then(() => this.events.calibrated?.(calibrate(onsets, grid, o.beatsPerBar)));
      }, waitMs);
    }
  }

  /**
   * Play-along with a reference: the microphone only (recorded, for the player to keep or discard at stop),
   * judged against `grid` — the reference's beats as the player hears them, kept up to date by the caller. Resolves with the context time of
   * the microphone's first sound (the caller starts the music a fixed margin after it), or null when the card
   * left the screen meanwhile; rejects with a MicrophoneError.
   */
  async startAlong(grid: TargetGrid, latencySec: number): Promise<number | null> {
    if (this.running) return null;
    const opened = await this.openMicrophone();
    if (!opened) return null;
    this.latencySec = latencySec;
    this.feedback = new LiveFeedback(grid);
    const first = await opened.firstInput;
    // The take runs from the microphone's first sound, the margin before the music: an early first note is kept.
    this.takeFrom = first;
    this.post({ type: 'record', from: first });
    return first + ALONG_MARGIN_SEC;
  }

  /** The capture worklet with the microphone in it; null when disposed while the browser asked. */
  private async openMicrophone(): Promise<{ ctx: AudioContext; firstInput: Promise<number> } | null> {
    const ctx = await resumeAudio();
    this.ctx = ctx;
    if (!navigator.mediaDevices?.getUserMedia) throw micError(null);
    // The worklet is loaded and its node made before the microphone opens, and the microphone is connected
    // the moment it is granted: its first samples reach the worklet at once instead of being dropped.
    await addWorkletModule(WORKLET_URL);
    const node = new AudioWorkletNode(ctx, 'tactus-capture', {
      numberOfInputs: 1,
      numberOfOutputs: 0,
      channelCount: 1,
      channelCountMode: 'explicit',
    });
    const firstInput = new Promise<number>((resolve) => {
      node.port.onmessage = (e: MessageEvent<FromCapture>) => {
        if (e.data.type === 'live') resolve(e.data.time);
        this.receive(e.data);
      };
    });
    try {
      // The player's sound as it is: no echo cancelling, noise suppression or gain riding, which smear attacks
      // and move the level the onset detector reads.
      this.stream = await navigator.mediaDevices.getUserMedia({
        audio: { echoCancellation: false, noiseSuppression: false, autoGainControl: false },
      });
    } catch (e) {
      node.port.postMessage({ type: 'unload' } satisfies ToCapture);
      throw micError(e);
    }
    if (this.disposed) {
      // The card left the screen while the browser asked: the microphone is released at once.
      this.stream.getTracks().forEach((t) => t.stop());
      node.port.postMessage({ type: 'unload' } satisfies ToCapture);
      return null;
    }
    this.source = ctx.createMediaStreamSource(this.stream);
    this.source.connect(node);
    this.node = node;
    this.running = true;
    this.chunks = [];
    this.onsets = [];
    return { ctx, firstInput };
  }

  private receive(m: FromCapture) {
    if (m.type === 'level') this.events.level?.(m.peak);
    else if (m.type === 'audio') this.chunks.push({ time: m.time, samples: m.samples });
    else if (m.type === 'stopped') this.stopped?.();
    else if (m.type === 'stats') this.events.stats?.(m);
    else if (m.type === 'onset') {
      this.onsets.push(m.time);
      const mark = this.feedback?.add(m.time - this.latencySec);
      if (mark) this.events.mark?.(mark, { time: m.time, receivedAt: this.ctx?.currentTime ?? 0 });
    }
  }

  /** Stops the run; returns the take (from just before the first beat after the count-in to now). */
  async stop(): Promise<RecordedTake | null> {
    if (!this.running || !this.ctx) return null;
    const to = this.ctx.currentTime;
    await this.finish();
    const sampleRate = this.ctx.sampleRate;
    if (to <= this.takeFrom) return null;
    const samples = assembleTake(this.chunks, this.takeFrom, to, this.latencySec, sampleRate);
    this.chunks = [];
    return { samples, sampleRate, seconds: samples.length / sampleRate };
  }

  /** Clicks stop, the last samples come back, the microphone is released (its light goes out). */
  private async finish() {
    if (this.calibrationTimer) clearTimeout(this.calibrationTimer);
    this.calibrationTimer = null;
    this.clicks?.stop();
    this.clicks = null;
    if (this.node) {
      const done = new Promise<void>((resolve) => {
        this.stopped = resolve;
        setTimeout(resolve, 500);
      });
      this.post({ type: 'stats' });
      this.post({ type: 'stop' });
      await done;
      this.post({ type: 'unload' });
      this.node.disconnect();
    }
    this.source?.disconnect();
    this.stream?.getTracks().forEach((t) => t.stop());
    this.gain?.disconnect();
    this.node = null;
    this.source = null;
    this.stream = null;
    this.gain = null;
    this.running = false;
  }

  /** Abandons a run without keeping anything (the card leaves the screen). */
  dispose() {
    this.disposed = true;
    void this.finish();
    this.chunks = [];
  }

  private post(m: ToCapture) {
    this.node?.port.postMessage(m);
  }
}

/** A take shorter than this is not offered to keep: a Stop pressed at once, a run the music ended at its start. */
const SHORTEST_TAKE_SEC = 1;

/** How a run ended, for its card: the take to listen back to and keep or discard, or why there is none. */
export type RunEnd = { take: RecordedTake; note: null } | { take: null; note: string };

/**
 * Ends a run the way both live cards do (recording against the click, playing along): the clicks stop, the
 * microphone is released and the take is cut; one long enough is offered for review, a shorter one is dropped
 * with a word saying so.
 */
export async function endRun(session: LiveSession): Promise<RunEnd> {
  const take = await session.stop();
  return take && take.seconds > SHORTEST_TAKE_SEC
    ? { take, note: null }
    : { take: null, note: 'That was too short to keep: nothing was recorded.' };
}

/** Plays a recorded take back once; returns a function that stops it. */
export async function listenBack(take: RecordedTake, onEnded: () => void): Promise<() => void> {
  const ctx = await resumeAudio();
  const buffer = ctx.createBuffer(1, take.samples.length, take.sampleRate);
  buffer.copyToChannel(take.samples as Float32Array<ArrayBuffer>, 0);
  const src = ctx.createBufferSource();
  src.buffer = buffer;
  src.connect(ctx.destination);
  src.onended = onEnded;
  src.start();
  return () => {
    src.onended = null;
    src.stop();
    src.disconnect();
  };
}
