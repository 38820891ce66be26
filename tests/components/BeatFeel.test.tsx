// The beat-you-feel control: each metrical level with its BPM (half and double of 120 are 60 and 240, common
// practice), the question "does it feel like 60 or 120?" with a short listen of each when the analysis says the two
// levels are close, and none when it does not.
import React from 'react';
import { fireEvent, render, screen } from '@testing-library/react';
import { BeatFeel } from '@/components/audition/BeatFeel';
import type { Analysis, Recording } from '@/shared/schemas';

const beats = Array.from({ length: 16 }, (_, i) => 0.5 + i * 0.5);
const analysis: Analysis = {
  bpm: 120,
  confidence: 0.9,
  candidates: [],
  beats,
  downbeats: beats.filter((_, i) => i % 4 === 0),
  meter: '4/4',
  curve: [],
  startBpm: 120,
  endBpm: 120,
  driftPct: 0,
  stabilityCv: 0,
  beatCount: beats.length,
  durationSec: 8.5,
  analysisMs: 10,
  levelAmbiguous: false,
  levels: [],
};
const recording = {
  id: 'r1',
  songId: 's1',
  ownerId: 'u1',
  kind: 'reference',
  label: null,
  originalName: 'a.wav',
  format: 'wav',
  sizeBytes: 1,
  durationSec: 8.5,
  status: 'done',
  progress: 1,
  error: null,
  originalBpm: 120,
  correctedBpm: null,
  beatOffsetSec: null,
  beatLevel: 'as-found',
  barOneSec: null,
  nudgeMs: 0,
  analysis,
  createdAt: new Date(0).toISOString(),
} as Recording;

test('each level with its BPM; no question when the levels are not in doubt', () => {
  render(
    <BeatFeel
      recording={recording}
      analysis={analysis}
      beats={beats}
      getPosition={() => 0}
      canEdit
      onListen={() => {}}
    />,
  );
  expect(screen.getByText('Half · 60')).toBeTruthy();
  expect(screen.getByText('As found · 120')).toBeTruthy();
  expect(screen.getByText('Double · 240')).toBeTruthy();
  expect(screen.queryByTestId('level-question')).toBeNull();
});

test('an ambiguous level asks "60 or 120?" and plays a short listen of each', () => {
  const listened: string[] = [];
  const ambiguous = { ...analysis, levelAmbiguous: true } as Analysis;
  render(
    <BeatFeel
      recording={recording}
      analysis={ambiguous}
      beats={beats}
      getPosition={() => 0}
      canEdit
      onListen={(l) => listened.push(l)}
    />,
  );
  expect(screen.getByText(/Does it feel like 60 or 120\?/)).toBeTruthy();
  fireEvent.click(screen.getByText('Listen at 60'));
  fireEvent.click(screen.getByText('Listen at 120'));
  expect(listened).toEqual(['half', 'as-found']);
});
