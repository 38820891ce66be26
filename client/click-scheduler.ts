// Clicks on the audio clock, for the audition player and the plain metronome alike. A timer on the main
// thread wakes every TICK_MS and hands the audio clock every click due in the next LOOKAHEAD_SEC, so a timer
// that fires late (a busy main thread) does not make a click late: the audio clock plays it on time. What clicks there are comes from the user (the player's beat grid through its playback
// map, the metronome's timeline); this module only schedules them, keeps them cancellable and remembers the
// one heard last.
import { scheduleBlip } from './click-sound';

/**
 * How far ahead clicks are handed to the audio clock: several timer ticks, so a late tick or two is covered, yet
 * short, because a click once handed over is only taken back by cancelling it. A 25 ms timer scheduling about
 * 100 ms ahead is the usual Web Audio practice (Chris Wilson, "A Tale of Two Clocks", HTML5 Rocks, 2013; from memory).
 */
export const LOOKAHEAD_SEC = 0.12;
/** Timer period: well inside the look-ahead, so there are about five chances to schedule each click. */
const TICK_MS = 25;

export interface ClickToPlay {
  /** Context time of the click. */
  time: number;
  accent: boolean;
  /** The beat's place in the bar (0 = downbeat), where the source knows it. */
  inBar?: number;
}

interface Planned {
  at: number;
  osc: OscillatorNode;
  inBar: number | null;
}

export class ClickScheduler {
  private timer: ReturnType<typeof setInterval> | null = null;
  private until = 0;
  private planned: Planned[] = [];
  /** Clicks handed to the audio clock since this scheduler was made. */
  count = 0;

  constructor(
    private readonly ctx: BaseAudioContext,
    private readonly destination: AudioNode,
    /** The clicks due in [from, until) of context time. */
    private readonly source: (from: number, until: number) => ClickToPlay[],
    /** Runs after each tick, with the context time (the player checks for the recording's end here). */
    private readonly afterTick?: (now: number) => void,
  ) {}

  get running() {
    return this.timer !== null;
  }

  /** Everything before context time `from` is taken as done; clicks are scheduled from there on. */
  start(from: number) {
    // Clicks added before (a count-in) stay.
    if (this.timer) clearInterval(this.timer);
    this.until = from;
    this.timer = setInterval(() => this.tick(), TICK_MS);
    this.tick();
  }

  /** No more clicks; those not yet heard are silenced. */
  stop() {
    if (this.timer) clearInterval(this.timer);
    this.timer = null;
    this.cancelFrom(0);
  }

  /** Up to where clicks have been handed to the audio clock (a change counts from here). */
  get scheduledUntil() {
    return this.until;
  }

  /** One click outside the source (the player's count-in). */
  add(at: number, accent: boolean, inBar: number | null = null) {
    this.planned.push({ at, osc: scheduleBlip(this.ctx, this.destination, at, accent), inBar });
    this.count++;
  }

  /** Clicks planned from context time `at` on (not yet heard) belong to an old timeline: drop them, and plan again from there. */
  cancelFrom(at: number) {
    const now = this.ctx.currentTime;
    this.until = Math.min(this.until, Math.max(at, now));
    this.planned = this.planned.filter((p) => {
      if (p.at < at || p.at < now) return true;
      p.osc.stop(0);
      p.osc.disconnect();
      return false;
    });
  }

  /** The place in the bar of the click heard last; null when none has been heard yet. */
  lastHeard(): number | null {
    const now = this.ctx.currentTime;
    let last: Planned | null = null;
    for (const p of this.planned) if (p.at <= now && (!last || p.at >= last.at)) last = p;
    return last ? last.inBar : null;
  }

  private tick() {
    const now = this.ctx.currentTime;
    const until = now + LOOKAHEAD_SEC;
    if (until > this.until) {
      for (const c of this.source(this.until, until)) this.add(c.time, c.accent, c.inBar ?? null);
      this.until = until;
    }
    // Clicks already heard are dropped, all but the last (it says which beat is sounding).
    const heard = this.planned.filter((p) => p.at <= now);
    if (heard.length > 1) {
      const last = heard.reduce((a, b) => (b.at >= a.at ? b : a));
      this.planned = this.planned.filter((p) => p.at > now || p === last);
    }
    this.afterTick?.(now);
  }
}
