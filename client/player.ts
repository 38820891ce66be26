// The audition player in the browser. The recording is stretched block by block by LivePlayback
// (audio/playback/live-playback.ts) on the audio thread, in an AudioWorklet (audio/playback/worklet/stretch-processor.ts); where
// the browser offers none (an insecure origin, an old browser) the same code runs in a ScriptProcessor on the
// main thread. The main thread keeps a copy of the playback timeline for the click, which it schedules on the
// recording's beat grid (audio/playback/click.ts), and for the position shown.
import {
  beatsPerBar as perBarOf,
  clicksBetween,
  countIn,
  type Click,
  PlaybackMap,
  type PlaybackSegment,
} from '@/audio/playback/click';
import type { StartOptions } from '@/audio/playback/live-playback';
import { PlaybackHost, type FromEngine, type RenderStats, type ToEngine } from '@/audio/playback/playback-host';
import { wrapIntoLoop, type Passage } from '@/audio/practice/passage';
import { encodeWav, renderAtTempo } from '@/audio/playback/export';
import { stretchOffline, type StereoBuffer } from '@/audio/playback/stretch';
import { DEFAULT_STRETCH_METHOD, heardOffsetFor } from '@/audio/playback/stretch-method';
import { SignalsmithEngine, stretchOfflineSignalsmith } from '@/audio/playback/signalsmith';
import type { StretchMethod } from '@/shared/schemas';
import { DEFAULT_CLICK_GAIN } from './click-sound';
import { addWorkletModule, audioContext, resumeAudio } from './audio-context';
import { ClickScheduler } from './click-scheduler';

/**
 * How long the player waits for the worklet's stretcher before asking for overlap-add instead: far longer than
 * one WebAssembly compile and set-up should take (our choice, not a measured bound), so it only catches a
 * set-up that will never finish; the play button says "Loading…" meanwhile.
 */
const READY_WAIT_MS = 10_000;
/** Frames per block of the ScriptProcessor fallback (the worklet renders 128 at a time). */
const FALLBACK_BLOCK = 1024;
/** Time between pressing Play and the first sound, so the first block is never late. */
const START_MARGIN_SEC = 0.06;
export const MIN_SPEED = 0.4;
export const MAX_SPEED = 2;
const WORKLET_URL = `${process.env.EXPO_BASE_URL ?? ''}/stretch-processor.js`;

export interface PlayerGrid {
  beats: number[];
  downbeats: number[];
  originalBpm: number;
  meter: string | null;
}

/** Figures the benchmark reads: how late tempo changes are heard, and how busy the audio rendering is. */
export interface PlayerStats extends RenderStats {
  engine: 'audio-worklet' | 'script-processor';
  /** The stretch method in use (overlap-add where the phase vocoder could not start). */
  stretchMethod: StretchMethod;
  /** Seconds from each tempo change to the first block rendered at the new tempo (audio clock). */
  changeLatencies: number[];
}

/** The audio-thread half, behind one interface whichever way it runs. */
interface Engine {
  send(m: ToEngine): void;
  node: AudioNode;
}

export class AuditionPlayer {
  private ctx: AudioContext | null = null;
  private decoded: { durationSec: number; sampleRate: number } | null = null;
  /** The samples on the main thread: kept only for the ScriptProcessor engine; the worklet holds its own. */
  private audio: StereoBuffer | null = null;
  private engine: Engine | null = null;
  private map: PlaybackMap | null = null;
  private clicks: ClickScheduler | null = null;
  private startFrom = 0;
  private speed = 1;
  private musicStartsAt = 0;
  private musicGain: GainNode | null = null;
  private clickGain: GainNode | null = null;
  private loop: Passage | null = null;
  /** Context times of the count-in's beats of the current start (empty without a count-in). */
  private countInTimes: number[] = [];
  private countInEnd = 0;
  /** Another grid the click follows for a while (a short listen of another beat level); null: the recording's. */
  private clickGrid: { beats: number[]; downbeats: number[] } | null = null;
  /** Numbers each start, so reports from an earlier run that arrive late are ignored. */
  private run = 0;
  private disposed = false;
  private readyTimer: ReturnType<typeof setTimeout> | null = null;
  clickOn = true;
  countInOn = false;
  playing = false;
  /** Called each time playback passes the loop's end. */
  onLoopPass: ((pass: number) => void) | null = null;
  /** Called when playback reaches the end of the recording and stops. */
  onEnded: (() => void) | null = null;
  /**
   * Called when the beats' context times change from `at` on (a start, a tempo change heard, a pause, a new
   * grid): whoever keeps those times ahead (play-along feedback) forgets them from there and asks `beatTimes` again.
   */
  private onTimeline: ((at: number) => void) | null = null;
  readonly stats: PlayerStats = {
    engine: 'audio-worklet',
    stretchMethod: DEFAULT_STRETCH_METHOD,
    changeLatencies: [],
    busyMs: 0,
    audioMs: 0,
    blocks: 0,
    maxBlockMs: 0,
  };

  /** Resolves the load once the engine says its stretcher is built. */
  private onReady: (() => void) | null = null;

  constructor(
    private readonly url: string,
    /** The beat grid as the player feels it; `setGrid` replaces it. */
    private grid: PlayerGrid,
    /** The stretch method asked for (the person's preference). */
    private readonly method: StretchMethod = DEFAULT_STRETCH_METHOD,
  ) {}

  get durationSec() {
    return this.decoded?.durationSec ?? 0;
  }
  get sampleRate() {
    return this.decoded?.sampleRate ?? 44100;
  }
  get loopRegion() {
    return this.loop;
  }
  /** Playback speed, × the recording's own tempo. */
  get playbackSpeed() {
    return this.speed;
  }

  async load(): Promise<void> {
    const ctx = audioContext();
    this.ctx = ctx;
    const audio = await this.decode(ctx);
    this.musicGain = ctx.createGain();
    this.musicGain.connect(ctx.destination);
    this.clickGain = ctx.createGain();
    this.clickGain.gain.value = DEFAULT_CLICK_GAIN;
    this.clickGain.connect(ctx.destination);
    this.clicks = new ClickScheduler(
      ctx,
      this.clickGain,
      (from, until) => this.beatClicks(from, until),
      (now) => this.checkEnd(now),
    );
    const ready = new Promise<void>((resolve) => (this.onReady = resolve));
    this.engine = (await this.workletEngine(ctx, audio)) ?? this.scriptProcessorEngine(ctx, audio);
    this.engine.node.connect(this.musicGain);
    await ready;
    // Thrown away while it loaded (the screen was left): what was just made leaves the page's context too.
    if (this.disposed) this.dispose();
  }

  /** Seconds into the recording being heard now. */
  position(): number {
    if (!this.ctx || !this.map || !this.playing) return this.startFrom;
    const v = this.map.recordingTime(Math.max(this.ctx.currentTime, this.musicStartsAt));
    return Math.min(this.durationSec, Math.max(0, wrapIntoLoop(v, this.loop)));
  }

  /** The count-in beat sounding now (1, 2, …), or null when no count-in is under way. */
  countInBeat(): number | null {
    if (!this.ctx || !this.playing || this.countInTimes.length === 0) return null;
    const now = this.ctx.currentTime;
    // The count ends on the recording's first beat (the music may come in a little before it).
    if (now >= this.countInEnd) return null;
    let n = 0;
    for (const t of this.countInTimes) if (t <= now + 1e-3) n++;
    return n === 0 ? null : n;
  }

  /** The click on another grid from now on (null: back to the recording's); the music is not touched. */
  clickOnGrid(grid: { beats: number[]; downbeats: number[] } | null) {
    this.clickGrid = grid;
    if (this.ctx) this.clicks?.cancelFrom(this.ctx.currentTime);
  }

  /** Who is told when the beats' context times change (null: nobody). */
  followTimeline(listener: ((at: number) => void) | null) {
    this.onTimeline = listener;
  }

  /**
   * A corrected beat grid (another beat level, bar one, a nudge): the click and the bar readout follow from the
   * next beat on, at the same speed; the decoded audio and the engine stay as they are.
   */
  setGrid(grid: PlayerGrid) {
    this.grid = grid;
    if (this.ctx && this.playing) {
      this.clicks?.cancelFrom(this.ctx.currentTime);
      this.onTimeline?.(this.ctx.currentTime);
    }
  }

  /** Playback tempo in BPM; while playing it is heard from the next audio block on, at the same beat. */
  setBpm(bpm: number) {
    const speed = this.speedFor(bpm);
    this.speed = speed;
    if (this.playing && this.ctx) this.engine?.send({ type: 'speed', speed, requestedAt: this.ctx.currentTime });
  }

  /** Click level 0…1 (linear gain). */
  setClickVolume(v: number) {
    if (this.clickGain) this.clickGain.gain.value = Math.max(0, Math.min(1, v));
  }

  /** Music level 0…1; 0 leaves the click alone on the recording's beats. */
  setMusicVolume(v: number) {
    if (this.musicGain) this.musicGain.gain.value = Math.max(0, Math.min(1, v));
  }

  /** Loop a passage (null: no loop). Playing goes on from the passage's start. */
  setLoop(p: Passage | null) {
    const wasPlaying = this.playing;
    this.pause();
    this.loop = p && p.end > p.start ? p : null;
    if (this.loop) this.startFrom = this.loop.start;
    if (wasPlaying) void this.play();
  }

  /** Plays from the current place; `at` (context seconds) asks for the music to start then, not sooner. */
  async play(at?: number) {
    if (!this.ctx || !this.engine || !this.clicks || this.playing) return;
    this.playing = true;
    const ctx = await resumeAudio();
    if (!this.loop && this.startFrom >= this.durationSec - 0.05) this.startFrom = 0;

    // The music comes in after the count-in bar, so that the count-in's beats run on into the recording's.
    const now = Math.max(ctx.currentTime + START_MARGIN_SEC, at ?? 0);
    let startsAt = now;
    if (this.countInOn) {
      const perBar = perBarOf(this.grid.meter);
      const playbackBpm = this.grid.originalBpm * this.speed;
      const firstBeat = this.grid.beats.find((b) => b >= this.startFrom - 1e-6);
      const toFirstBeat = firstBeat === undefined ? 0 : (firstBeat - this.startFrom) / this.speed;
      startsAt = now + Math.max(0, (perBar * 60) / playbackBpm - toFirstBeat);
      const beats = countIn(startsAt + toFirstBeat, perBar, playbackBpm);
      this.countInTimes = beats.map((c) => c.time);
      this.countInEnd = startsAt + toFirstBeat;
      for (const c of beats) this.clicks.add(c.time + this.heardOffset(this.speed), c.accent);
    } else this.countInTimes = [];
    const options: StartOptions = { fromSec: this.startFrom, speed: this.speed, startsAt, loop: this.loop };
    this.musicStartsAt = startsAt;
    this.map = new PlaybackMap(startsAt, this.startFrom, this.speed);
    this.run += 1;
    this.engine.send({ type: 'start', options, run: this.run });
    this.clicks.start(startsAt);
    this.onTimeline?.(startsAt);
  }

  pause() {
    if (!this.playing) return;
    this.startFrom = this.position();
    this.playing = false;
    this.engine?.send({ type: 'stop' });
    this.clicks?.stop();
    if (this.ctx) this.onTimeline?.(this.ctx.currentTime);
  }

  seek(sec: number) {
    const wasPlaying = this.playing;
    this.pause();
    // Before the audio is decoded its length is not known yet: the place is kept as asked.
    this.startFrom = Math.max(0, this.decoded ? Math.min(this.durationSec, sec) : sec);
    if (this.loop && (this.startFrom < this.loop.start || this.startFrom >= this.loop.end)) this.loop = null;
    if (wasPlaying) void this.play();
  }

  /**
   * The recording, or the loop, at `bpm` (pitch kept) as a WAV file. With the worklet engine the samples live on
   * the audio thread only (one copy of a long recording is enough for a phone), so they are decoded again here.
   */
  async renderWav(bpm: number, passage: Passage | null): Promise<Uint8Array> {
    if (!this.ctx || !this.decoded) throw new Error('the audio is not loaded yet');
    const audio = this.audio ?? (await this.decode(this.ctx));
    const sr = this.sampleRate;
    // The file sounds as the player did: the same stretch method.
    const engine = this.stats.stretchMethod === 'phase-vocoder' ? await SignalsmithEngine.create(sr) : null;
    const stretch = (part: StereoBuffer, tempo: number) =>
      engine ? stretchOfflineSignalsmith(engine, part, tempo) : stretchOffline(part, tempo, sr);
    return encodeWav(renderAtTempo(audio, sr, this.speedFor(bpm), passage, stretch), sr);
  }

  /** Where the music's attacks are heard against the timeline at `speed`, for the method in use. */
  private heardOffset(speed: number) {
    return heardOffsetFor(this.stats.stretchMethod, speed);
  }

  /** × the recording's own tempo for `bpm`, within the player's range. */
  private speedFor(bpm: number) {
    return Math.max(MIN_SPEED, Math.min(MAX_SPEED, bpm / this.grid.originalBpm));
  }

  private async decode(ctx: BaseAudioContext): Promise<StereoBuffer> {
    const res = await fetch(this.url, { credentials: 'include' });
    if (!res.ok) throw new Error(`the audio could not be loaded (${res.status})`);
    const buffer = await ctx.decodeAudioData(await res.arrayBuffer());
    this.decoded = { durationSec: buffer.duration, sampleRate: buffer.sampleRate };
    const left = buffer.getChannelData(0);
    return { left, right: buffer.numberOfChannels > 1 ? buffer.getChannelData(1) : left };
  }

  /** Starts the figures afresh (the benchmark measures one phase at a time). */
  resetStats() {
    Object.assign(this.stats, { changeLatencies: [], busyMs: 0, audioMs: 0, blocks: 0, maxBlockMs: 0 });
    this.engine?.send({ type: 'reset-stats' });
  }

  /** The context is the page's and stays; this player's nodes leave it, and the engine lets its samples go. */
  dispose() {
    this.disposed = true;
    if (this.readyTimer) clearTimeout(this.readyTimer);
    this.pause();
    this.engine?.send({ type: 'unload' });
    this.engine?.node.disconnect();
    this.musicGain?.disconnect();
    this.clickGain?.disconnect();
    this.engine = null;
  }

  /** What the audio thread reports. */
  private receive(m: FromEngine) {
    if (m.type === 'ready') {
      if (this.readyTimer) clearTimeout(this.readyTimer);
      this.readyTimer = null;
      this.stats.stretchMethod = m.method;
      this.onReady?.();
      return;
    }
    if (m.type !== 'stats' && (m.run !== this.run || !this.playing)) return;
    if (m.type === 'segment') {
      if (!this.map) return;
      const seg: PlaybackSegment = { at: m.at, from: m.from, speed: m.speed };
      this.map.addSegment(seg);
      this.clicks?.cancelFrom(seg.at);
      this.onTimeline?.(seg.at);
      this.stats.changeLatencies.push(m.at - m.requestedAt);
    } else if (m.type === 'pass') {
      this.onLoopPass?.(m.pass);
    } else {
      const { type: _, ...figures } = m;
      Object.assign(this.stats, figures);
    }
  }

  private async workletEngine(ctx: AudioContext, audio: StereoBuffer): Promise<Engine | null> {
    if (!ctx.audioWorklet || typeof AudioWorkletNode === 'undefined') return null;
    try {
      await addWorkletModule(WORKLET_URL);
    } catch {
      return null;
    }
    const node = new AudioWorkletNode(ctx, 'tactus-stretch', {
      numberOfInputs: 0,
      numberOfOutputs: 1,
      outputChannelCount: [2],
    });
    node.port.onmessage = (e: MessageEvent<FromEngine>) => this.receive(e.data);
    // The worklet gets its own copy of the samples, handed over without a second copy; the decoded buffer is
    // then dropped on this side.
    const left = audio.left.slice();
    const right = audio.right === audio.left ? null : audio.right.slice();
    node.port.postMessage(
      { type: 'load', left, right, method: this.method } satisfies ToEngine,
      right ? [left.buffer, right.buffer] : [left.buffer],
    );
    this.stats.engine = 'audio-worklet';
    // A phase vocoder whose WebAssembly cannot start may hang instead of failing: past this wait the worklet
    // builds overlap-add from the same samples.
    this.readyTimer = setTimeout(() => node.port.postMessage({ type: 'fallback' } satisfies ToEngine), READY_WAIT_MS);
    return { node, send: (m) => node.port.postMessage(m) };
  }

  private scriptProcessorEngine(ctx: AudioContext, audio: StereoBuffer): Engine {
    this.audio = audio;
    // Reports go out of the audio callback asynchronously, as the worklet's messages do.
    const host = new PlaybackHost(
      this.sampleRate,
      (m) => setTimeout(() => this.receive(m), 0),
      () => performance.now(),
    );
    host.receive({
      type: 'load',
      left: audio.left,
      right: audio.right === audio.left ? null : audio.right,
      method: this.method,
    });
    const node = ctx.createScriptProcessor(FALLBACK_BLOCK, 0, 2);
    let nextBlockAt = 0;
    node.onaudioprocess = (e) => {
      // Chromium says when this block will be heard; elsewhere count blocks from the first.
      const blockAt =
        Number.isFinite(e.playbackTime) && e.playbackTime > 0 ? e.playbackTime : nextBlockAt || ctx.currentTime;
      nextBlockAt = blockAt + FALLBACK_BLOCK / ctx.sampleRate;
      host.render(e.outputBuffer.getChannelData(0), e.outputBuffer.getChannelData(1), blockAt);
    };
    this.stats.engine = 'script-processor';
    return { node, send: (m) => host.receive(m) };
  }

  /**
   * The recording's beats heard in [from, until) of context time while playing, where the click puts them: the
   * stretched attacks come a little early or late (audio/playback/stretch.ts), and the click follows the music.
   * `beat` is the beat's index in the grid (a loop repeats it).
   */
  beatTimes(from: number, until: number): Click[] {
    if (!this.ctx || !this.map || !this.playing) return [];
    const map = this.map;
    const grid = this.clickGrid ?? this.grid;
    return clicksBetween(map, grid.beats, grid.downbeats, from, until, this.loop).map((c) => ({
      ...c,
      time: c.time + this.heardOffset(map.speedAt(c.time)),
    }));
  }

  /** The grid's beats and downbeats the click follows now. */
  get beatGrid(): { beats: number[]; downbeats: number[] } {
    return this.clickGrid ?? this.grid;
  }

  /** The recording's beats due in [from, until) of context time, while the click is on. */
  private beatClicks(from: number, until: number) {
    if (!this.clickOn || !this.ctx) return [];
    const now = this.ctx.currentTime;
    return this.beatTimes(from, until).map((c) => ({ time: Math.max(now, c.time), accent: c.accent }));
  }

  /** Playback without a loop stops at the recording's end. */
  private checkEnd(now: number) {
    if (!this.map || this.loop || now <= this.musicStartsAt || this.map.recordingTime(now) < this.durationSec) return;
    this.pause();
    this.startFrom = this.durationSec;
    this.onEnded?.();
  }
}
