// A set list's songs: each one's length at its chosen tempo or why there is none, the total that says what it
// leaves out, and the up/down buttons handing over the whole new order.
import React from 'react';
import { fireEvent, render, screen } from '@testing-library/react';
import { SetListSongs } from '@/components/setlists/SetListSongs';
import { totalLength } from '@/components/setlists/lengths';
import type { SetListDto } from '@/shared/schemas';

// 248 beats at 124 BPM last 248 × 60 / 124 = 120 s (2:00); at 62 BPM twice that, 240 s (4:00). Total 6:00.
const list: SetListDto = {
  id: 'l1',
  name: 'Harbour Lane, Friday',
  songs: [
    { songId: 'a', title: 'Copperline Reel', meter: '4/4', chosenBpm: 124, durationSec: 120 },
    { songId: 'b', title: 'Saltmarsh Air', meter: '4/4', chosenBpm: 62, durationSec: 240 },
    { songId: 'c', title: 'Nine Steps Waltz', meter: '3/4', chosenBpm: null, durationSec: null },
    { songId: 'd', title: 'Moss and Granite', meter: '5/4', chosenBpm: 84, durationSec: null },
  ],
  totalSec: 360,
  unknownDurations: 2,
  updatedAt: '2026-12-02T12:00:00.000Z',
};

test('each song reads its length or why it has none', () => {
  render(<SetListSongs list={list} busy={false} onOrder={() => {}} />);
  expect(screen.getAllByTestId('set-list-song-length').map((e) => e.textContent)).toEqual([
    '2:00',
    '4:00',
    'no chosen tempo yet',
    'no analysed recording, so no length',
  ]);
});

test('the total says which songs it does not count', () => {
  expect(totalLength(list)).toBe('6:00 in all at the chosen tempos, not counting 2 songs without a length');
  expect(totalLength({ ...list, songs: list.songs.slice(0, 2), unknownDurations: 0 })).toBe(
    '6:00 in all at the chosen tempos',
  );
  expect(totalLength({ ...list, songs: [], totalSec: 0, unknownDurations: 0 })).toBe('No songs yet');
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
