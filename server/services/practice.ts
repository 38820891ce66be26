// A song's practice log: entries by hand or from step-up runs, on the whole piece, a saved passage or a loop
// of a recording; a player's whole log across songs, and its CSV export. Logging never moves a working tempo:
// the app offers the raise (audio/practice/progress.ts) and the player applies it through the tempos routes.
import { Op } from 'sequelize';
import { stringify } from 'csv-stringify/sync';
import { PracticeEntry, Song } from '@/server/models';
import { HttpError } from '@/server/http';
import type { Me, PracticeEntryDto, PracticeInput, PracticeLogEntry } from '@/shared/schemas';
import { assertMay } from './access';
import { passageFor } from './passages';
import { recordingOfSong } from './recordings';
import { songFor } from './songs';

export const toPracticeDto = (p: PracticeEntry): PracticeEntryDto => ({
  id: p.id,
  songId: p.songId,
  passage: p.passage,
  passageId: p.passageId,
  recordingId: p.recordingId,
  startSec: p.startSec,
  endSec: p.endSec,
  startBar: p.startBar,
  endBar: p.endBar,
  startBpm: p.startBpm,
  reachedBpm: p.reachedBpm,
  repetitions: p.repetitions,
  minutes: p.minutes,
  clean: Boolean(p.clean),
  note: p.note,
  createdAt: p.createdAt.toISOString(),
  loggedAt: p.updatedAt.toISOString(),
});

/** The latest 500 entries, newest first. */
export async function listPractice(user: Me, songId: string): Promise<PracticeEntryDto[]> {
  const song = await songFor(user, 'read', songId);
  await assertMay(user, 'read', 'practice-entry', song.ownerId);
  return (await PracticeEntry.findAll({ where: { songId: song.id }, order: [['createdAt', 'DESC']], limit: 500 })).map(
    toPracticeDto,
  );
}

/** Where the entry was played: a saved passage (its region copied), a loop of a recording, or the whole piece. */
async function whereItWasPlayed(user: Me, songId: string, input: PracticeInput) {
  if (input.passageId) {
    const passage = await passageFor(user, 'read', input.passageId).catch(() => null);
    if (!passage || passage.songId !== songId)
      throw new HttpError(400, 'invalid_body', 'passageId: choose a passage of this song', 'passageId');
    const { recordingId, startSec, endSec, startBar, endBar } = passage;
    return {
      passage,
      label: input.passage ?? passage.name,
      region: { passageId: passage.id, recordingId, startSec, endSec, startBar, endBar },
    };
  }
  const none = { passageId: null, recordingId: null, startSec: null, endSec: null, startBar: null, endBar: null };
  if (!input.recordingId) return { passage: null, label: input.passage ?? null, region: none };
  await recordingOfSong(songId, input.recordingId);
  if (
    (input.startSec == null) !== (input.endSec == null) ||
    (input.startSec != null && input.endSec! <= input.startSec)
  ) {
    throw new HttpError(
      400,
      'invalid_body',
      'endSec: give where the loop starts and ends, the end after the start',
      'endSec',
    );
  }
  const region = {
    ...none,
    recordingId: input.recordingId,
    startSec: input.startSec ?? null,
    endSec: input.endSec ?? null,
    startBar: input.startBar ?? null,
    endBar: input.endBar ?? null,
  };
  return { passage: null, label: input.passage ?? null, region };
}

/** A practice entry, by hand (now, or on a day up to a year back) or from a step-up run; only the song's owner logs. */
export async function logPractice(user: Me, songId: string, input: PracticeInput): Promise<PracticeEntryDto> {
  const song = await songFor(user, 'write', songId);
  await assertMay(user, 'write', 'practice-entry', song.ownerId);
  const where = await whereItWasPlayed(user, song.id, input);
  const entry = await PracticeEntry.create({
    songId: song.id,
    userId: user.id,
    passage: where.label,
    ...where.region,
    startBpm: input.startBpm,
    reachedBpm: input.reachedBpm,
    repetitions: input.repetitions,
    minutes: input.minutes,
    clean: input.clean,
    note: input.note || null,
    // A session logged later counts on the day it was played: the log, charts and weeks all read createdAt.
    ...(input.practisedAt ? { createdAt: new Date(input.practisedAt) } : {}),
  });
  return toPracticeDto(entry);
}

/** Every entry on the songs `user` owns, newest first, with the song's title. */
export async function myPracticeLog(user: Me): Promise<PracticeLogEntry[]> {
  await assertMay(user, 'read', 'practice-entry', user.id);
  const songs = await Song.findAll({ where: { ownerId: user.id }, attributes: ['id', 'title'] });
  const titles = new Map(songs.map((s) => [s.id, s.title]));
  if (titles.size === 0) return [];
  const entries = await PracticeEntry.findAll({
    where: { songId: { [Op.in]: [...titles.keys()] } },
    order: [['createdAt', 'DESC']],
  });
  return entries.map((e) => ({ ...toPracticeDto(e), songTitle: titles.get(e.songId)! }));
}

/** The columns of the export, in order: the header row names them as a spreadsheet shows them. */
const CSV_COLUMNS = [
  'date',
  'song',
  'passage',
  'first bar',
  'last bar',
  'start BPM',
  'reached BPM',
  'clean',
  'repetitions',
  'minutes',
  'note',
] as const;

/**
 * The whole log as CSV, oldest first: RFC 4180 (a header row, commas, fields holding a comma, quote or line
 * break quoted with inner quotes doubled, CRLF between records), dates as ISO 8601 in UTC.
 */
export async function practiceCsv(user: Me): Promise<{ fileName: string; csv: string }> {
  const log = (await myPracticeLog(user)).reverse();
  const rows = log.map((e) => [
    e.createdAt,
    e.songTitle,
    e.passage ?? '',
    e.startBar ?? '',
    e.endBar ?? '',
    e.startBpm,
    e.reachedBpm,
    e.clean ? 'yes' : 'no',
    e.repetitions,
    e.minutes,
    e.note ?? '',
  ]);
  const csv = stringify(rows, {
    header: true,
    columns: [...CSV_COLUMNS],
    record_delimiter: 'windows',
    // With CRLF records the library quotes only fields holding a whole CRLF; a note typed with a bare line feed
    // must be quoted too, or a reader would split the record there.
    quoted_match: /[\r\n]/,
  });
  return { fileName: `practice-log-${new Date().toISOString().slice(0, 10)}.csv`, csv };
}
