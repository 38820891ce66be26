// The plain metronome (click-only mode): any BPM and meter, accent on the first beat of the bar. The beats
// come from MetronomeTimeline (audio/playback/click.ts) and go to the audio clock through the click scheduler
// (client/click-scheduler.ts), as the player's do; a tempo or meter change takes effect from the next beat.
import { beatsPerBar, MetronomeTimeline } from '@/audio/playback/click';
import { DEFAULT_CLICK_GAIN } from './click-sound';
import { resumeAudio } from './audio-context';
import { ClickScheduler } from './click-scheduler';

/** Time between pressing Start and the first click, so the first one is never late. */
const START_MARGIN_SEC = 0.05;

export class Metronome {
  private gain: GainNode | null = null;
  private clicksOut: ClickScheduler | null = null;
  private timeline: MetronomeTimeline | null = null;
  private bpm = 100;
  private meter = '4/4';
  private volume = DEFAULT_CLICK_GAIN;
  running = false;

  /** Clicks scheduled so far (what the browser test reads). */
  get clicks() {
    return this.clicksOut?.count ?? 0;
  }

  async start() {
    if (this.running) return;
    const ctx = await resumeAudio();
    if (!this.gain || !this.clicksOut) {
      this.gain = ctx.createGain();
      this.gain.connect(ctx.destination);
      this.clicksOut = new ClickScheduler(
        ctx,
        this.gain,
        (from, until) => this.timeline?.clicksBetween(from, until) ?? [],
      );
    }
    this.gain.gain.value = this.volume;
    const start = ctx.currentTime + START_MARGIN_SEC;
    this.timeline = new MetronomeTimeline(start, this.bpm, beatsPerBar(this.meter));
    this.running = true;
    this.clicksOut.start(start);
  }

  stop() {
    this.running = false;
    this.clicksOut?.stop();
  }

  set(bpm: number, meter: string) {
    this.bpm = bpm;
    this.meter = meter;
    if (this.running && this.timeline && this.clicksOut) {
      // Beats already handed to the audio clock stay; the change counts from the first one not yet scheduled.
      this.timeline.change(this.clicksOut.scheduledUntil, bpm, beatsPerBar(meter));
    }
  }

  /** The beat sounding now, as its place in the bar (0 = downbeat), for the beat lights; null when stopped. */
  beatNow(): number | null {
    if (!this.running || !this.clicksOut) return null;
    return this.clicksOut.lastHeard();
  }

  setVolume(v: number) {
    this.volume = Math.max(0, Math.min(1, v));
    if (this.gain) this.gain.gain.value = this.volume;
  }

  /** The context is the page's and stays; the metronome's own node leaves it. */
  dispose() {
    this.stop();
    this.gain?.disconnect();
    this.gain = null;
    this.clicksOut = null;
  }
}
