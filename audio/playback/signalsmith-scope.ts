// Imported by audio/playback/signalsmith.ts just before the signalsmith-stretch package, so the package evaluates
// in a stand-in worklet scope: seeing an AudioWorkletProcessor class and registerProcessor, it registers its
// processor class (whose constructor builds the WebAssembly module) instead of exporting a Web Audio node factory.
// signalsmith.ts puts the real globals back as soon as the package has run.

/** What the package's processor class offers us: the WebAssembly module it builds. */
export type CapturedProcessor = new (options: object) => { wasmModule: unknown };

export const standIn: {
  processor: CapturedProcessor | null;
  /** Told by the processor being built that its module is ready (it posts 'ready' on its port). */
  onReady: (() => void) | null;
  restore(): void;
} = { processor: null, onReady: null, restore: () => {} };

/** Stands in for the worklet's base class: a port whose 'ready' message ends a build. */
class StandInProcessor {
  port = {
    onmessage: null as unknown,
    postMessage(message: unknown) {
      if (Array.isArray(message) && message[0] === 'ready') standIn.onReady?.();
    },
  };
}

const scope = globalThis as Record<string, unknown>;
const names = ['AudioWorkletProcessor', 'registerProcessor'] as const;
const saved = names.map((name) => [name, Object.getOwnPropertyDescriptor(scope, name)] as const);
scope.AudioWorkletProcessor = StandInProcessor;
scope.registerProcessor = (_name: string, ctor: CapturedProcessor) => {
  standIn.processor = ctor;
};
standIn.restore = () => {
  for (const [name, descriptor] of saved) {
    if (descriptor) Object.defineProperty(scope, name, descriptor);
    else delete scope[name];
  }
};
