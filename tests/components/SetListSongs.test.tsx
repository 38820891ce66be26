// A set list's songs: each one's tempo (chosen, analysed and marked not chosen, or none in words) and length at
// it or why there is none, the total that says what it leaves out and when it is an estimate, and the up/down
// buttons handing over the whole new order.
import React from 'react';
import { fireEvent, render, screen } from '@testing-library/react';
import { SetListSongs } from '@/components/setlists/SetListSongs';
import { totalLength } from '@/components/setlists/lengths';
import type { SetListDto } from '@/shared/schemas';

// 248 beats at 124 BPM last 248 × 60 / 124 = 120 s (2:00); at 62 BPM twice that, 240 s (4:00). A song with no
// chosen tempo whose recording measured 192 beats at 96 BPM lasts 192 × 60 / 96 = 120 s (2:00) as recorded.
const list: SetListDto = {
  id: 'l1',
  name: 'Harbour Lane, Friday',
  songs: [
    {
      songId: 'a',
      title: 'Copperline Reel',
      meter: '4/4',
      chosenBpm: 124,
      analysedBpm: 123.8,
      durationSec: 120,
      durationAt: 'chosen',
    },
    {
      songId: 'b',
      title: 'Saltmarsh Air',
      meter: '4/4',
      chosenBpm: 62,
      analysedBpm: 124,
      durationSec: 240,
      durationAt: 'chosen',
    },
    {
      songId: 'c',
      title: 'Nine Steps Waltz',
      meter: '3/4',
      chosenBpm: null,
      analysedBpm: null,
      durationSec: null,
      durationAt: null,
    },
    {
      songId: 'd',
      title: 'Moss and Granite',
      meter: '5/4',
      chosenBpm: 84,
      analysedBpm: null,
      durationSec: null,
      durationAt: null,
    },
  ],
  totalSec: 360,
  unknownDurations: 2,
  estimatedDurations: 0,
  updatedAt: '2026-12-02T12:00:00.000Z',
};
const gullRock: SetListDto['songs'][number] = {
  songId: 'e',
  title: 'Gull Rock Hornpipe',
  meter: '4/4',
  chosenBpm: null,
  analysedBpm: 95.6,
  durationSec: 120,
  durationAt: 'analysed',
};

test('each song reads its length or why it has none; one not chosen is measured at its analysed tempo', () => {
  render(<SetListSongs list={{ ...list, songs: [...list.songs, gullRock] }} busy={false} onOrder={() => {}} />);
  expect(screen.getAllByTestId('set-list-song-length').map((e) => e.textContent)).toEqual([
    '2:00',
    '4:00',
    'no analysed recording, so no length',
    'no analysed recording, so no length',
    '≈ 2:00 at the analysed tempo',
  ]);
});

test('a chosen tempo reads as the click; an analysed one is marked not chosen; none says so, never a bare dash', () => {
  render(<SetListSongs list={{ ...list, songs: [...list.songs, gullRock] }} busy={false} onOrder={() => {}} />);
  const tempos = screen.getAllByTestId('set-list-song-tempo');
  expect(tempos.map((e) => e.textContent)).toEqual([
    '124 BPM',
    '62 BPM',
    'No tempo chosen',
    '84 BPM',
    // Rounded to a whole BPM: a guide, not a setting.
    '≈ 96BPM, not chosen',
  ]);
  expect(tempos.map((e) => e.getAttribute('aria-label'))).toEqual([
    '124 BPM',
    '62 BPM',
    'No tempo chosen',
    '84 BPM',
    'about 96 BPM as analysed; no tempo chosen yet',
  ]);
  expect(tempos.some((e) => e.textContent?.includes('—'))).toBe(false);
});

test('the total says which songs it does not count, and when it is an estimate from analysed tempos', () => {
  expect(totalLength(list)).toBe('6:00 in all at the chosen tempos, not counting 2 songs without a length');
  expect(totalLength({ ...list, songs: list.songs.slice(0, 2), unknownDurations: 0 })).toBe(
    '6:00 in all at the chosen tempos',
  );
  // 6:00 at chosen tempos plus the hornpipe's 2:00 as recorded.
  const withEstimate = { ...list, songs: [...list.songs, gullRock], totalSec: 480, estimatedDurations: 1 };
  expect(totalLength(withEstimate)).toBe(
    'About 8:00 in all, an estimate: 1 song at its analysed tempo, not a chosen one; not counting 2 songs without a length',
  );
  const onlyEstimates = {
    ...list,
    songs: [gullRock, { ...gullRock, songId: 'f' }],
    totalSec: 240,
    unknownDurations: 0,
    estimatedDurations: 2,
  };
  expect(totalLength(onlyEstimates)).toBe(
    'About 4:00 in all, an estimate at the analysed tempos (no tempo chosen yet)',
  );
  expect(totalLength({ ...list, songs: [], totalSec: 0, unknownDurations: 0 })).toBe('No songs yet');
  expect(totalLength({ ...list, songs: list.songs.slice(2), totalSec: 0 })).toBe('No song has a length yet');
});

test('moving a song up or down hands over the whole new order; the ends cannot move further', () => {
  const onOrder = jest.fn();
  render(<SetListSongs list={list} busy={false} onOrder={onOrder} />);
  fireEvent.click(screen.getByLabelText('Move Saltmarsh Air up'));
  expect(onOrder).toHaveBeenLastCalledWith(['b', 'a', 'c', 'd']);
  fireEvent.click(screen.getByLabelText('Move Copperline Reel down'));
  expect(onOrder).toHaveBeenLastCalledWith(['b', 'a', 'c', 'd']);
  fireEvent.click(screen.getByLabelText('Take Nine Steps Waltz out of the set list'));
  expect(onOrder).toHaveBeenLastCalledWith(['a', 'b', 'd']);
  fireEvent.click(screen.getByLabelText('Move Copperline Reel up'));
  fireEvent.click(screen.getByLabelText('Move Moss and Granite down'));
  expect(onOrder).toHaveBeenCalledTimes(3);
});
