// The audition player in the browser: the recording through our Stretcher (audio/stretch.ts) in the Web Audio
// graph, and a click scheduled on the recording's beat grid through the playback timeline (audio/click.ts).
// Tempo changes apply to the next audio block and keep the musical position.
import { planarSource, Stretcher } from '../audio/stretch';
import { clicksBetween, PlaybackMap } from '../audio/click';

const BLOCK = 4096;
const LOOKAHEAD_SEC = 0.12;
/** Default click level, well below full scale (a sudden loud click in headphones is what hurts). */
export const DEFAULT_CLICK_GAIN = 0.25;

export interface PlayerGrid {
  beats: number[];
  downbeats: number[];
  originalBpm: number;
}

export class AuditionPlayer {
  private ctx: AudioContext | null = null;
  private buffer: AudioBuffer | null = null;
  private node: ScriptProcessorNode | null = null;
  private stretcher: Stretcher | null = null;
  private map: PlaybackMap | null = null;
  private timer: ReturnType<typeof setInterval> | null = null;
  private scheduledUntil = 0;
  private startFrom = 0;
  private speed = 1;
  private readonly music: { gain: GainNode | null } = { gain: null };
  private clickGain: GainNode | null = null;
  clickOn = true;
  playing = false;

  constructor(private readonly url: string, private readonly grid: PlayerGrid) {}

  get durationSec() {
    return this.buffer?.duration ?? 0;
  }

  async load(): Promise<void> {
    const Ctx = window.AudioContext ?? (window as unknown as { webkitAudioContext: typeof AudioContext }).webkitAudioContext;
    this.ctx = new Ctx();
    const res = await fetch(this.url, { credentials: 'include' });
    if (!res.ok) throw new Error(`the audio could not be loaded (${res.status})`);
    this.buffer = await this.ctx.decodeAudioData(await res.arrayBuffer());
    this.music.gain = this.ctx.createGain();
    this.music.gain.connect(this.ctx.destination);
    this.clickGain = this.ctx.createGain();
    this.clickGain.gain.value = DEFAULT_CLICK_GAIN;
    this.clickGain.connect(this.ctx.destination);
  }

  /** Seconds into the recording being heard now. */
  position(): number {
    if (!this.ctx || !this.map || !this.playing) return this.startFrom;
    return Math.min(this.durationSec, Math.max(0, this.map.recordingTime(this.ctx.currentTime)));
  }

  setBpm(bpm: number) {
    this.speed = Math.max(0.4, Math.min(2, bpm / this.grid.originalBpm));
    if (this.stretcher) this.stretcher.tempo = this.speed;
    if (this.ctx && this.map && this.playing) {
      this.map.changeSpeed(this.ctx.currentTime, this.speed);
      this.scheduledUntil = this.ctx.currentTime;
    }
  }

  setClickVolume(v: number) {
    if (this.clickGain) this.clickGain.gain.value = Math.max(0, Math.min(1, v));
  }

  async play() {
    if (!this.ctx || !this.buffer || this.playing) return;
    await this.ctx.resume();
    const b = this.buffer;
    const left = b.getChannelData(0);
    const right = b.numberOfChannels > 1 ? b.getChannelData(1) : left;
    const source = planarSource({ left, right });
    this.stretcher = new Stretcher(source, this.speed);
    this.stretcher.seek(this.startFrom * b.sampleRate);
    const node = this.ctx.createScriptProcessor(BLOCK, 2, 2);
    const frames = new Float32Array(2 * BLOCK);
    node.onaudioprocess = (e) => {
      const outL = e.outputBuffer.getChannelData(0);
      const outR = e.outputBuffer.getChannelData(1);
      const got = this.stretcher!.extract(frames, BLOCK);
      for (let i = 0; i < BLOCK; i++) {
        outL[i] = i < got ? frames[2 * i]! : 0;
        outR[i] = i < got ? frames[2 * i + 1]! : 0;
      }
    };
    node.connect(this.music.gain!);
    this.node = node;
    // The first stretched block is heard one block after now.
    const startsAt = this.ctx.currentTime + BLOCK / this.ctx.sampleRate;
    this.map = new PlaybackMap(startsAt, this.startFrom, this.speed);
    this.scheduledUntil = startsAt;
    this.playing = true;
    this.timer = setInterval(() => this.scheduleClicks(), 25);
  }

  pause() {
    if (!this.playing) return;
    this.startFrom = this.position();
    this.playing = false;
    if (this.timer) clearInterval(this.timer);
    this.node?.disconnect();
    this.node = null;
  }

  seek(sec: number) {
    const wasPlaying = this.playing;
    this.pause();
    this.startFrom = Math.max(0, Math.min(this.durationSec, sec));
    if (wasPlaying) void this.play();
  }

  dispose() {
    this.pause();
    void this.ctx?.close();
  }

  private scheduleClicks() {
    if (!this.ctx || !this.map || !this.clickOn) return;
    const until = this.ctx.currentTime + LOOKAHEAD_SEC;
    for (const c of clicksBetween(this.map, this.grid.beats, this.grid.downbeats, this.scheduledUntil, until)) this.blip(c.time, c.accent);
    this.scheduledUntil = until;
    if (this.position() >= this.durationSec) this.pause();
  }

  private blip(at: number, accent: boolean) {
    const ctx = this.ctx!;
    const osc = ctx.createOscillator();
    const env = ctx.createGain();
    osc.frequency.value = accent ? 1760 : 1320;
    env.gain.setValueAtTime(0, at);
    env.gain.linearRampToValueAtTime(accent ? 1 : 0.6, at + 0.002);
    env.gain.exponentialRampToValueAtTime(0.001, at + 0.05);
    osc.connect(env).connect(this.clickGain!);
    osc.start(at);
    osc.stop(at + 0.06);
  }
}
