// The plain metronome (click-only mode): any BPM and meter, accent on the first beat of the bar. The beats
// come from MetronomeTimeline (audio/playback/click.ts) and are scheduled a little ahead on the audio clock; a tempo or
// meter change takes effect from the next beat.
import { beatsPerBar, MetronomeTimeline } from '@/audio/playback/click';
import { DEFAULT_CLICK_GAIN, newAudioContext, scheduleBlip } from './click-sound';

const LOOKAHEAD_SEC = 0.12;

export class Metronome {
  private ctx: AudioContext | null = null;
  private gain: GainNode | null = null;
  private timer: ReturnType<typeof setInterval> | null = null;
  private timeline: MetronomeTimeline | null = null;
  private scheduledUntil = 0;
  private planned: { at: number; osc: OscillatorNode; inBar: number }[] = [];
  private bpm = 100;
  private meter = '4/4';
  private volume = DEFAULT_CLICK_GAIN;
  running = false;

  /** Clicks scheduled so far (what the browser test reads). */
  clicks = 0;

  async start() {
    if (this.running) return;
    this.ctx ??= newAudioContext();
    await this.ctx.resume();
    this.gain = this.ctx.createGain();
    this.gain.gain.value = this.volume;
    this.gain.connect(this.ctx.destination);
    const start = this.ctx.currentTime + 0.05;
    this.timeline = new MetronomeTimeline(start, this.bpm, beatsPerBar(this.meter));
    this.scheduledUntil = start;
    this.running = true;
    this.timer = setInterval(() => this.schedule(), 25);
    this.schedule();
  }

  stop() {
    if (this.timer) clearInterval(this.timer);
    this.timer = null;
    this.running = false;
    for (const p of this.planned) p.osc.stop(0);
    this.planned = [];
    this.gain?.disconnect();
  }

  set(bpm: number, meter: string) {
    this.bpm = bpm;
    this.meter = meter;
    if (this.running && this.timeline && this.ctx) {
      // Beats already handed to the audio clock stay; the change counts from the first one not yet scheduled.
      this.timeline.change(this.scheduledUntil, bpm, beatsPerBar(meter));
    }
  }

  /** The beat sounding now, as its place in the bar (0 = downbeat), for the beat lights; null when stopped. */
  beatNow(): number | null {
    if (!this.running || !this.ctx) return null;
    const now = this.ctx.currentTime;
    let current: number | null = null;
    for (const p of this.planned) if (p.at <= now) current = p.inBar;
    return current;
  }

  setVolume(v: number) {
    this.volume = Math.max(0, Math.min(1, v));
    if (this.gain) this.gain.gain.value = this.volume;
  }

  dispose() {
    this.stop();
    void this.ctx?.close();
  }

  private schedule() {
    const ctx = this.ctx!;
    const until = ctx.currentTime + LOOKAHEAD_SEC;
    // Keep the last beat heard (the beat lights read it) and the ones still to come.
    this.planned = this.planned.filter((p) => p.at > ctx.currentTime - 60 / this.bpm - 0.05);
    for (const c of this.timeline!.clicksBetween(this.scheduledUntil, until)) {
      this.planned.push({ at: c.time, osc: scheduleBlip(ctx, this.gain!, c.time, c.accent), inBar: c.inBar ?? 0 });
      this.clicks++;
    }
    this.scheduledUntil = Math.max(this.scheduledUntil, until);
  }
}
