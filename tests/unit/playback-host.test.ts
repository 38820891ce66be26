// The engine host when the phase vocoder's set-up never finishes (WebAssembly that cannot compile may hang rather
// than fail): asked to fall back, it builds overlap-add from the samples it was handed, and the player can play.
// Truth by construction: a made-up sine and a set-up that is made never to resolve.
import { PlaybackHost, type FromEngine } from '@/audio/playback/playback-host';

jest.mock('@/audio/playback/stretch-method', () => {
  const actual = jest.requireActual('@/audio/playback/stretch-method');
  return {
    ...actual,
    stretcherMaker: (method: string, sampleRate: number) =>
      method === 'phase-vocoder' ? new Promise(() => {}) : actual.stretcherMaker(method, sampleRate),
  };
});

const SR = 44100;
const flush = () => new Promise((r) => setTimeout(r, 0));

function sine(seconds: number) {
  const x = new Float32Array(Math.round(seconds * SR));
  for (let i = 0; i < x.length; i++) x[i] = 0.5 * Math.sin((2 * Math.PI * 220 * i) / SR);
  return x;
}

test('a phase vocoder that never starts: no ready until the fallback, then ready with overlap-add and sound', async () => {
  const out: FromEngine[] = [];
  const host = new PlaybackHost(
    SR,
    (m) => out.push(m),
    () => 0,
  );
  host.receive({ type: 'load', left: sine(2), right: null, method: 'phase-vocoder' });
  await flush();
  expect(out.filter((m) => m.type === 'ready')).toEqual([]);

  host.receive({ type: 'fallback' });
  await flush();
  expect(out.filter((m) => m.type === 'ready')).toEqual([{ type: 'ready', method: 'overlap-add' }]);

  host.receive({ type: 'start', run: 1, options: { fromSec: 0, speed: 1, startsAt: 0, loop: null } });
  const left = new Float32Array(128);
  const right = new Float32Array(128);
  let peak = 0;
  for (let block = 0; block < 40; block++) {
    host.render(left, right, (block * 128) / SR);
    for (const v of left) peak = Math.max(peak, Math.abs(v));
  }
  expect(peak).toBeGreaterThan(0.1);
});

test('a fallback after the stretcher is ready changes nothing', async () => {
  const out: FromEngine[] = [];
  const host = new PlaybackHost(
    SR,
    (m) => out.push(m),
    () => 0,
  );
  host.receive({ type: 'load', left: sine(1), right: null, method: 'overlap-add' });
  await flush();
  host.receive({ type: 'fallback' });
  await flush();
  expect(out.filter((m) => m.type === 'ready')).toEqual([{ type: 'ready', method: 'overlap-add' }]);
});
