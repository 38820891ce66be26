// The page's one AudioContext, shared by the audition player, the plain metronome and the click sound. A page
// gets one: every context holds an output stream and an audio thread of its own, browsers cap how many may be
// open, and clocks of different contexts cannot be compared. It is made when first needed; browsers keep a
// context made outside a user gesture suspended, so whatever starts sound calls resumeAudio() from the gesture
// (Play, Start). Users disconnect their own nodes when done: the context lives as long as the page.

let shared: AudioContext | null = null;
const modules = new Map<string, Promise<void>>();

export function audioContext(): AudioContext {
  if (!shared || shared.state === 'closed') {
    const Ctx =
      window.AudioContext ?? (window as unknown as { webkitAudioContext: typeof AudioContext }).webkitAudioContext;
    shared = new Ctx();
    modules.clear();
  }
  return shared;
}

/** Lets the context run; call it from the user gesture that starts sound. */
export async function resumeAudio(): Promise<AudioContext> {
  const ctx = audioContext();
  if (ctx.state !== 'running') await ctx.resume();
  return ctx;
}

/** Loads an AudioWorklet module into the shared context once, however many players ask for it. */
export function addWorkletModule(url: string): Promise<void> {
  const ctx = audioContext();
  let loading = modules.get(url);
  if (!loading) {
    loading = ctx.audioWorklet.addModule(url);
    // A failed load may be tried again (the next player on the page asks afresh).
    loading.catch(() => modules.delete(url));
    modules.set(url, loading);
  }
  return loading;
}
