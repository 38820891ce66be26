// The click's sound: a short sine blip, higher and louder on the downbeat. Shared by the audition player and
// the plain metronome (through client/click-scheduler.ts, on the page's context) so both sound alike.

/** Default click level, well below full scale (a sudden loud click in headphones is what hurts). */
export const DEFAULT_CLICK_GAIN = 0.25;

/** Schedules one click at context time `at`; returns the oscillator so a stale click can be cancelled. */
export function scheduleBlip(
  ctx: BaseAudioContext,
  destination: AudioNode,
  at: number,
  accent: boolean,
): OscillatorNode {
  const osc = ctx.createOscillator();
  const env = ctx.createGain();
  osc.frequency.value = accent ? 1760 : 1320;
  env.gain.setValueAtTime(0, at);
  env.gain.linearRampToValueAtTime(accent ? 1 : 0.6, at + 0.002);
  env.gain.exponentialRampToValueAtTime(0.001, at + 0.05);
  osc.connect(env).connect(destination);
  osc.start(at);
  osc.stop(at + 0.06);
  return osc;
}
