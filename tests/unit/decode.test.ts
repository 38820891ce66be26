// Decoding every supported format, and the engine on the committed clips against the tempo maps they were
// rendered from (fixtures/generate.ts --clips; truth known by construction).
import fs from 'node:fs';
import path from 'node:path';
import { analyse } from '@/audio/analysis/analyse';
import { accuracy1, beatFMeasure } from '@/audio/analysis/evaluation';
import { decodeFile, NotAudioError } from '@/server/analysis/decode';
import type { Truth } from '@/fixtures/pieces';

const CLIPS = path.resolve(__dirname, '../../fixtures/clips');
const clips = fs
  .readdirSync(CLIPS)
  .filter((f) => f.endsWith('.truth.json'))
  .map((f) => f.replace('.truth.json', ''));
const FORMATS = ['wav', 'mp3', 'ogg', 'flac', 'm4a'];

describe.each(clips)('clip %s', (name) => {
  const truth = JSON.parse(fs.readFileSync(path.join(CLIPS, `${name}.truth.json`), 'utf8')) as Truth;

  test.each(FORMATS)('decodes from %s and reads the notated tempo within 4 % with its beats', async (format) => {
    const { samples, sampleRate } = await decodeFile(path.join(CLIPS, `${name}.${format}`));
    expect(samples.length / sampleRate).toBeGreaterThan(truth.durationSec - 0.2);
    expect(samples.length / sampleRate).toBeLessThan(truth.durationSec + 0.2);
    const a = await analyse(samples, sampleRate);
    expect(accuracy1(a.bpm!, truth.bpm)).toBe(true);
    // ±70 ms window as mir_eval's beat F-measure; clips are short, so no 5 s trim here.
    expect(beatFMeasure(truth.beats, a.beats)).toBeGreaterThan(0.9);
  });
});

describe('files that are not audio', () => {
  test.each([
    ['a PNG', path.resolve(__dirname, '../../assets/favicon.png')],
    ['this test file', __filename],
  ])('%s is refused with NotAudioError', async (_label, file) => {
    await expect(decodeFile(file)).rejects.toBeInstanceOf(NotAudioError);
  });
});
