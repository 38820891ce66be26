// A human drum performance from the Groove MIDI Dataset (Gillick et al., ICML 2019), played to a 138 BPM
// metronome and not quantised (../shared/reference-data/groove-midi/info.csv), rendered here with fluidsynth.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { analyse } from '@/audio/analysis/analyse';
import { accuracy1 } from '@/audio/analysis/evaluation';
import { decodeFile } from '@/server/analysis/decode';
import { renderMidi } from '@/fixtures/render';
import { describeWithReferenceData, REFERENCE_DATA } from '@/tests/reference-data';

const MIDI = path.join(REFERENCE_DATA, 'groove-midi/1_funk-groove1_138_beat_4-4.mid');

describeWithReferenceData('a human drummer from the Groove MIDI Dataset', () => {
  test('the drummer reads 138 BPM within 4 % (Accuracy1)', async () => {
    const wav = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'tactus-groove-')), 'groove.wav');
    renderMidi(MIDI, wav);
    const { samples, sampleRate } = await decodeFile(wav);
    expect(samples.length / sampleRate).toBeGreaterThan(27);
    const a = await analyse(samples, sampleRate);
    expect(accuracy1(a.bpm!, 138)).toBe(true);
    expect(a.meter).toBe('4/4');
  });
});
