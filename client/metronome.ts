// The plain metronome (click-only mode): any BPM and meter, accent on the first beat of the bar. Clicks are
// scheduled a little ahead on the audio clock; a tempo or meter change takes effect from the next beat.
import { beatsPerBar } from '../audio/click';
import { DEFAULT_CLICK_GAIN, newAudioContext, scheduleBlip } from './click-sound';

const LOOKAHEAD_SEC = 0.12;

export class Metronome {
  private ctx: AudioContext | null = null;
  private gain: GainNode | null = null;
  private timer: ReturnType<typeof setInterval> | null = null;
  private nextAt = 0;
  private beatInBar = 0;
  private planned: { at: number; osc: OscillatorNode }[] = [];
  bpm = 100;
  meter = '4/4';
  running = false;
  private volume = DEFAULT_CLICK_GAIN;

  async start() {
    if (this.running) return;
    this.ctx ??= newAudioContext();
    await this.ctx.resume();
    this.gain = this.ctx.createGain();
    this.gain.gain.value = this.volume;
    this.gain.connect(this.ctx.destination);
    this.nextAt = this.ctx.currentTime + 0.05;
    this.beatInBar = 0;
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
    const perBar = beatsPerBar(this.meter);
    this.planned = this.planned.filter((p) => p.at > ctx.currentTime - 0.2);
    while (this.nextAt < ctx.currentTime + LOOKAHEAD_SEC) {
      if (this.beatInBar >= perBar) this.beatInBar = 0;
      this.planned.push({ at: this.nextAt, osc: scheduleBlip(ctx, this.gain!, this.nextAt, this.beatInBar === 0) });
      this.beatInBar += 1;
      this.nextAt += 60 / this.bpm;
    }
  }
}
