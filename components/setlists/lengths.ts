// How a set list's lengths read: each song's length at its chosen tempo, or why there is none; the total.
import { formatDuration, plural } from '@/shared/format';
import type { SetListDto } from '@/shared/schemas';

type SetListSong = SetListDto['songs'][number];

/** "3:12", or why the song has no length yet. */
export function songLength(song: SetListSong): string {
  if (song.durationSec !== null) return formatDuration(song.durationSec);
  if (song.chosenBpm === null) return 'no chosen tempo yet';
  return 'no analysed recording, so no length';
}

/** "12:34 in all at the chosen tempos", with the songs left out named as a count: a total that is not the whole says so. */
export function totalLength(list: SetListDto): string {
  if (list.songs.length === 0) return 'No songs yet';
  const total = `${formatDuration(list.totalSec)} in all at the chosen tempos`;
  if (list.unknownDurations === 0) return total;
  if (list.unknownDurations === list.songs.length) return 'No song has a length yet';
  return `${total}, not counting ${plural(list.unknownDurations, 'song')} without a length`;
}
