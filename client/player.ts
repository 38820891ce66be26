// The audition player in the browser: the recording through our Stretcher (audio/stretch.ts) in the Web Audio
// graph, and a click scheduled on the recording's beat grid through the playback timeline (audio/click.ts).
//
// A tempo change is applied at the start of the next audio block: a new stretcher starts at the exact musical
// position the timeline says is being heard there, cross-faded from the old one. (SoundTouch keeps up to
// ~16 k frames of already-stretched audio queued, so changing its tempo in place would be heard a third of a
// second late.) Loops run on a straight timeline over a looped source (audio/passage.ts).
import { loopedSource, planarSource, Stretcher, type StereoBuffer } from '../audio/stretch';
import { beatsPerBar as perBarOf, clicksBetween, countIn, PlaybackMap } from '../audio/click';
import { loopPass, wrapIntoLoop, type Passage } from '../audio/passage';
import { encodeWav, renderAtTempo } from '../audio/export';
import { DEFAULT_CLICK_GAIN, newAudioContext, scheduleBlip } from './click-sound';

/** Frames per audio block: ~23 ms at 44.1 kHz, so a tempo change is heard within about one block. */
export const BLOCK = 1024;
const CROSSFADE = 256;
const LOOKAHEAD_SEC = 0.12;
/** Time between pressing Play and the first sound, so the first block is never late. */
const START_MARGIN_SEC = 0.06;
export const MIN_SPEED = 0.4;
export const MAX_SPEED = 2;

export interface PlayerGrid {
  beats: number[];
  downbeats: number[];
  originalBpm: number;
  meter: string | null;
}

/** Figures the benchmark reads: how late tempo changes are heard, and how busy the audio callback is. */
export interface PlayerStats {
  /** Seconds from each tempo change to the first block played at the new tempo. */
  changeLatencies: number[];
  busyMs: number;
  audioMs: number;
  blocks: number;
  maxBlockMs: number;
}

export class AuditionPlayer {
  private ctx: AudioContext | null = null;
  private buffer: AudioBuffer | null = null;
  private audio: StereoBuffer | null = null;
  private node: ScriptProcessorNode | null = null;
  private stretcher: Stretcher | null = null;
  private map: PlaybackMap | null = null;
  private timer: ReturnType<typeof setInterval> | null = null;
  private scheduledUntil = 0;
  private scheduled: { at: number; osc: OscillatorNode }[] = [];
  private startFrom = 0;
  private speed = 1;
  private pending: { speed: number; requestedAt: number } | null = null;
  private musicStartsAt = 0;
  private nextBlockAt = 0;
  private passes = 0;
  private musicGain: GainNode | null = null;
  private clickGain: GainNode | null = null;
  private loop: Passage | null = null;
  clickOn = true;
  countInOn = false;
  playing = false;
  /** Called (outside the audio callback) each time playback passes the loop's end. */
  onLoopPass: ((pass: number) => void) | null = null;
  /** Called when playback reaches the end of the recording and stops. */
  onEnded: (() => void) | null = null;
  readonly stats: PlayerStats = { changeLatencies: [], busyMs: 0, audioMs: 0, blocks: 0, maxBlockMs: 0 };

  constructor(private readonly url: string, private readonly grid: PlayerGrid) {}

  get durationSec() {
    return this.buffer?.duration ?? 0;
  }
  get sampleRate() {
    return this.buffer?.sampleRate ?? 44100;
  }
  get bpm() {
    return this.grid.originalBpm * (this.pending?.speed ?? this.speed);
  }
  get loopRegion() {
    return this.loop;
  }

  async load(): Promise<void> {
    this.ctx = newAudioContext();
    const res = await fetch(this.url, { credentials: 'include' });
    if (!res.ok) throw new Error(`the audio could not be loaded (${res.status})`);
    this.buffer = await this.ctx.decodeAudioData(await res.arrayBuffer());
    const left = this.buffer.getChannelData(0);
    this.audio = { left, right: this.buffer.numberOfChannels > 1 ? this.buffer.getChannelData(1) : left };
    this.musicGain = this.ctx.createGain();
    this.musicGain.connect(this.ctx.destination);
    this.clickGain = this.ctx.createGain();
    this.clickGain.gain.value = DEFAULT_CLICK_GAIN;
    this.clickGain.connect(this.ctx.destination);
  }

  /** Seconds into the recording being heard now. */
  position(): number {
    if (!this.ctx || !this.map || !this.playing) return this.startFrom;
    const v = this.map.recordingTime(Math.max(this.ctx.currentTime, this.musicStartsAt));
    return Math.min(this.durationSec, Math.max(0, wrapIntoLoop(v, this.loop)));
  }

  /** Playback tempo in BPM; while playing it is heard from the next audio block on, at the same beat. */
  setBpm(bpm: number) {
    const speed = Math.max(MIN_SPEED, Math.min(MAX_SPEED, bpm / this.grid.originalBpm));
    if (this.playing && this.ctx) this.pending = { speed, requestedAt: this.ctx.currentTime };
    else this.speed = speed;
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
    this.passes = 0;
    if (wasPlaying) void this.play();
  }

  async play() {
    if (!this.ctx || !this.audio || this.playing) return;
    await this.ctx.resume();
    const ctx = this.ctx;
    const sr = this.sampleRate;
    if (!this.loop && this.startFrom >= this.durationSec - 0.05) this.startFrom = 0;
    if (this.pending) {
      this.speed = this.pending.speed;
      this.pending = null;
    }
    this.stretcher = this.newStretcher(this.startFrom, this.speed);
    this.passes = this.loop ? loopPass(this.startFrom, this.loop) : 0;

    // The music comes in after the count-in bar, so that the count-in's beats run on into the recording's.
    const now = ctx.currentTime + START_MARGIN_SEC;
    let musicStartsAt = now;
    const playbackBpm = this.grid.originalBpm * this.speed;
    if (this.countInOn) {
      const firstBeat = this.grid.beats.find((b) => b >= this.startFrom - 1e-6);
      const toFirstBeat = firstBeat === undefined ? 0 : (firstBeat - this.startFrom) / this.speed;
      const bar = (perBarOf(this.grid.meter) * 60) / playbackBpm;
      musicStartsAt = now + Math.max(0, bar - toFirstBeat);
      for (const c of countIn(musicStartsAt + toFirstBeat, perBarOf(this.grid.meter), playbackBpm)) this.click(c.time, c.accent);
    }
    this.musicStartsAt = musicStartsAt;
    this.map = new PlaybackMap(musicStartsAt, this.startFrom, this.speed);
    this.scheduledUntil = musicStartsAt;
    this.nextBlockAt = 0;

    const node = ctx.createScriptProcessor(BLOCK, 2, 2);
    const frames = new Float32Array(2 * BLOCK);
    const fade = new Float32Array(2 * CROSSFADE);
    node.onaudioprocess = (e) => {
      const t0 = performance.now();
      const outL = e.outputBuffer.getChannelData(0);
      const outR = e.outputBuffer.getChannelData(1);
      // Chromium reports when this block will be heard; count blocks ourselves where it does not.
      const blockAt = Number.isFinite(e.playbackTime) && e.playbackTime > 0 ? e.playbackTime : this.nextBlockAt || ctx.currentTime;
      this.nextBlockAt = blockAt + BLOCK / sr;
      const silent = Math.max(0, Math.min(BLOCK, Math.round((this.musicStartsAt - blockAt) * sr)));
      outL.fill(0, 0, silent);
      outR.fill(0, 0, silent);
      if (silent < BLOCK) {
        const at = blockAt + silent / sr;
        let fadeFrames = 0;
        if (this.pending && this.map) {
          // Restart the stretch where the timeline says this block begins, and keep the old one for a short fade.
          fadeFrames = this.stretcher!.extract(fade, CROSSFADE);
          const { speed, requestedAt } = this.pending;
          this.pending = null;
          this.stretcher = this.newStretcher(this.map.recordingTime(at), speed);
          this.map.changeSpeed(at, speed);
          this.speed = speed;
          this.cancelClicksFrom(at);
          this.stats.changeLatencies.push(at - requestedAt);
        }
        const n = BLOCK - silent;
        const got = this.stretcher!.extract(frames, n);
        for (let i = 0; i < n; i++) {
          let l = i < got ? frames[2 * i]! : 0;
          let r = i < got ? frames[2 * i + 1]! : 0;
          if (i < fadeFrames) {
            const w = i / fadeFrames;
            l = l * w + fade[2 * i]! * (1 - w);
            r = r * w + fade[2 * i + 1]! * (1 - w);
          }
          outL[silent + i] = l;
          outR[silent + i] = r;
        }
        if (this.loop && this.map) {
          const pass = loopPass(this.map.recordingTime(at), this.loop);
          if (pass > this.passes) {
            this.passes = pass;
            setTimeout(() => this.onLoopPass?.(pass), 0);
          }
        }
      }
      const busy = performance.now() - t0;
      this.stats.busyMs += busy;
      this.stats.audioMs += (BLOCK / sr) * 1000;
      this.stats.blocks += 1;
      this.stats.maxBlockMs = Math.max(this.stats.maxBlockMs, busy);
    };
    node.connect(this.musicGain!);
    this.node = node;
    this.playing = true;
    this.timer = setInterval(() => this.tick(), 25);
  }

  pause() {
    if (!this.playing) return;
    this.startFrom = this.position();
    if (this.pending) this.speed = this.pending.speed;
    this.pending = null;
    this.playing = false;
    if (this.timer) clearInterval(this.timer);
    this.cancelClicksFrom(0);
    this.node?.disconnect();
    this.node = null;
  }

  seek(sec: number) {
    const wasPlaying = this.playing;
    this.pause();
    this.startFrom = Math.max(0, Math.min(this.durationSec, sec));
    if (this.loop && (this.startFrom < this.loop.start || this.startFrom >= this.loop.end)) this.loop = null;
    if (wasPlaying) void this.play();
  }

  /** The recording, or the loop, at `bpm` (pitch kept) as a WAV file. */
  renderWav(bpm: number, passage: Passage | null): Uint8Array {
    if (!this.audio) throw new Error('the audio is not loaded yet');
    const speed = Math.max(MIN_SPEED, Math.min(MAX_SPEED, bpm / this.grid.originalBpm));
    return encodeWav(renderAtTempo(this.audio, this.sampleRate, speed, passage), this.sampleRate);
  }

  dispose() {
    this.pause();
    void this.ctx?.close();
  }

  private newStretcher(fromSec: number, speed: number): Stretcher {
    const sr = this.sampleRate;
    const source = this.loop
      ? loopedSource(this.audio!, { startFrame: Math.round(this.loop.start * sr), endFrame: Math.round(this.loop.end * sr) })
      : planarSource(this.audio!);
    const s = new Stretcher(source, speed);
    s.seek(fromSec * sr);
    return s;
  }

  private tick() {
    if (!this.ctx || !this.map) return;
    const until = this.ctx.currentTime + LOOKAHEAD_SEC;
    if (this.clickOn && until > this.scheduledUntil) {
      for (const c of clicksBetween(this.map, this.grid.beats, this.grid.downbeats, this.scheduledUntil, until, this.loop)) this.click(c.time, c.accent);
    }
    this.scheduledUntil = Math.max(this.scheduledUntil, until);
    const now = this.ctx.currentTime;
    this.scheduled = this.scheduled.filter((s) => s.at > now - 0.2);
    if (!this.loop && this.ctx.currentTime > this.musicStartsAt && this.map.recordingTime(now) >= this.durationSec) {
      this.pause();
      this.startFrom = this.durationSec;
      this.onEnded?.();
    }
  }

  private click(at: number, accent: boolean) {
    this.scheduled.push({ at, osc: scheduleBlip(this.ctx!, this.clickGain!, at, accent) });
  }

  /** Clicks planned on the old timeline after a change would land off the beat: drop them. */
  private cancelClicksFrom(at: number) {
    this.scheduledUntil = Math.min(this.scheduledUntil, Math.max(at, this.ctx?.currentTime ?? 0));
    this.scheduled = this.scheduled.filter((s) => {
      if (s.at < at || s.at < (this.ctx?.currentTime ?? 0)) return true;
      s.osc.stop(0);
      s.osc.disconnect();
      return false;
    });
  }
}
