// How a set list reads: each song's click tempo (chosen, or the analysed one marked as not chosen), its length
// at that tempo or why there is none, and the total, which says when it is an estimate or leaves songs out.
import { formatBpm, formatDuration, plural } from '@/shared/format';
import type { SetListDto } from '@/shared/schemas';

type SetListSong = SetListDto['songs'][number];

/** A song's tempo as the set list shows it: the figure (null: none to show), the words beside it, the words read
 * aloud, and whether it is the chosen one (drawn as such) or only a guide. */
export interface SongTempo {
  figure: string | null;
  words: string;
  spoken: string;
  chosen: boolean;
}

/** "96 BPM" when chosen; "≈ 96 BPM, not chosen" from the analysed recording; else "No tempo chosen". */
export function songTempo(song: SetListSong): SongTempo {
  if (song.chosenBpm !== null)
    return {
      figure: formatBpm(song.chosenBpm),
      words: 'BPM',
      spoken: `${formatBpm(song.chosenBpm)} BPM`,
      chosen: true,
    };
  if (song.analysedBpm !== null) {
    // A whole number: an analysed tempo is a guide until the player chooses, and a tenth would claim more.
    const bpm = formatBpm(Math.round(song.analysedBpm));
    return {
      figure: `≈ ${bpm}`,
      words: 'BPM, not chosen',
      spoken: `about ${bpm} BPM as analysed; no tempo chosen yet`,
      chosen: false,
    };
  }
  return { figure: null, words: 'No tempo chosen', spoken: 'No tempo chosen', chosen: false };
}

/** "3:12", "≈ 3:12 at the analysed tempo", or why the song has no length yet. */
export function songLength(song: SetListSong): string {
  if (song.durationSec === null) return 'no analysed recording, so no length';
  const length = formatDuration(song.durationSec);
  return song.durationAt === 'analysed' ? `≈ ${length} at the analysed tempo` : length;
}

/**
 * "12:34 in all at the chosen tempos"; "About 12:34 in all, an estimate: 1 song at its analysed tempo"; with the
 * songs left out named as a count. A total that is not exact, or not the whole, says so.
 */
export function totalLength(list: SetListDto): string {
  if (list.songs.length === 0) return 'No songs yet';
  if (list.unknownDurations === list.songs.length) return 'No song has a length yet';
  const sum = formatDuration(list.totalSec);
  const counted = list.songs.length - list.unknownDurations;
  const total =
    list.estimatedDurations === 0
      ? `${sum} in all at the chosen tempos`
      : list.estimatedDurations === counted
        ? `About ${sum} in all, an estimate at the analysed tempos (no tempo chosen yet)`
        : `About ${sum} in all, an estimate: ${plural(list.estimatedDurations, 'song')} at ${list.estimatedDurations === 1 ? 'its' : 'their'} analysed tempo, not a chosen one`;
  if (list.unknownDurations === 0) return total;
  return `${total}${list.estimatedDurations === 0 ? ',' : ';'} not counting ${plural(list.unknownDurations, 'song')} without a length`;
}
