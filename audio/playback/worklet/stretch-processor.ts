// The player's audio-thread half: an AudioWorkletProcessor around PlaybackHost (audio/playback/playback-host.ts, which
// also says what the messages are). Bundled on its own into public/stretch-processor.js by
// `npm run build:worklet`, because a worklet module loads as one plain script.
import { PlaybackHost, type ToEngine } from '@/audio/playback/playback-host';

// The AudioWorkletGlobalScope, declared here because TypeScript's DOM library does not describe it.
declare const currentTime: number;
declare const sampleRate: number;
declare function registerProcessor(name: string, ctor: unknown): void;
declare class AudioWorkletProcessor {
  readonly port: MessagePort;
}

// performance.now() is not offered in every worklet scope; Date.now() ticks in whole milliseconds, but summed
// over many blocks whose start is unrelated to the tick its error averages out.
const now: () => number = typeof performance !== 'undefined' ? () => performance.now() : () => Date.now();

class StretchProcessor extends AudioWorkletProcessor {
  private readonly host = new PlaybackHost(sampleRate, (m) => this.port.postMessage(m), now);

  constructor() {
    super();
    this.port.onmessage = (e: MessageEvent<ToEngine>) => this.host.receive(e.data);
  }

  process(_inputs: Float32Array[][], outputs: Float32Array[][]): boolean {
    const out = outputs[0]!;
    this.host.render(out[0]!, out[1] ?? out[0]!, currentTime);
    // Keep running until the player unloads (the page's audio context outlives every player on it).
    return !this.host.unloaded;
  }
}

registerProcessor('tactus-stretch', StretchProcessor);
