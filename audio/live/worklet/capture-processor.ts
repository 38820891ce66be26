// The microphone's audio-thread half: an AudioWorkletProcessor around CaptureHost (audio/live/capture-host.ts,
// which also says what the messages are), on the page's one AudioContext, so onsets and recorded samples are on
// the click's clock. Bundled on its own into public/capture-processor.js by `npm run build:worklet`.
import { CaptureHost, type ToCapture } from '@/audio/live/capture-host';

// The AudioWorkletGlobalScope, declared here because TypeScript's DOM library does not describe it.
declare const currentTime: number;
declare const sampleRate: number;
declare function registerProcessor(name: string, ctor: unknown): void;
declare class AudioWorkletProcessor {
  readonly port: MessagePort;
}

const now: () => number = typeof performance !== 'undefined' ? () => performance.now() : () => Date.now();

class CaptureProcessor extends AudioWorkletProcessor {
  private readonly host = new CaptureHost(sampleRate, (m, transfer) => this.port.postMessage(m, transfer ?? []), now);

  constructor() {
    super();
    this.port.onmessage = (e: MessageEvent<ToCapture>) => this.host.receive(e.data);
  }

  process(inputs: Float32Array[][]): boolean {
    // The first channel: microphones are mono, and a stereo interface's first input is where one is plugged.
    const input = inputs[0]?.[0];
    if (input) this.host.process(input, currentTime);
    return !this.host.unloaded;
  }
}

registerProcessor('tactus-capture', CaptureProcessor);
