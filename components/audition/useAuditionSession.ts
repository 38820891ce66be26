// Everything the audition player on one recording needs, joined: the beat grid as the player feels it, the
// player itself, the last loop kept across reloads, the song's saved passages on this recording, the step-up
// run and its logging, the break suggestion after long practice, play-along, keys, candidate tempos and export.
// AuditionPanel only lays the parts out.
import { useCallback, useEffect, useMemo, useState } from 'react';
import { useCandidates, useNotes, usePassages } from '@/client/hooks';
import { keepLastLoop, readLastLoop } from '@/client/last-loop';
import { describePassage, type Passage as Region } from '@/audio/practice/passage';
import { feltGrid, type BeatLevel } from '@/audio/practice/beat-grid';
import { beatsPerBar } from '@/audio/playback/click';
import type { Passage, Recording, Song } from '@/shared/schemas';
import type { SnapUnit } from './PassageLoop';
import { useAuditionPlayer } from './useAuditionPlayer';
import { useStepUpRun } from './useStepUpRun';
import { useBreakReminder } from './useBreakReminder';
import { usePlayerKeys } from './usePlayerKeys';
import { useWavExport } from './useWavExport';
import { usePlayAlong } from './usePlayAlong';

/** A short listen of a beat level: two bars at 70 BPM in 4/4 (about 7 s), long enough to feel where the beat
 * falls, short enough to compare two at once (from memory; no standard sets it). */
const LISTEN_SEC = 7;
/** Loop edges within a millisecond of a saved passage's are that passage. */
const SAME_EDGE_SEC = 1e-3;
const samePlace = (a: Region, p: Passage) =>
  Math.abs(a.start - p.startSec) < SAME_EDGE_SEC && Math.abs(a.end - p.endSec) < SAME_EDGE_SEC;

export function useAuditionSession({
  recording,
  song,
  canEdit,
  audioUrl,
}: {
  recording: Recording;
  song: Song | undefined;
  canEdit: boolean;
  audioUrl: string;
}) {
  const a = recording.analysis!;
  const meter = a.meter ?? song?.meter ?? null;
  const { beatLevel, barOneSec, nudgeMs } = recording;
  const originalBpm = recording.originalBpm!;
  const feltAt = useCallback(
    (level: BeatLevel) =>
      feltGrid(
        { beats: a.beats, downbeats: a.downbeats, bpm: originalBpm },
        { beatLevel: level, barOneSec, nudgeMs },
        beatsPerBar(meter),
      ),
    [a.beats, a.downbeats, originalBpm, barOneSec, nudgeMs, meter],
  );
  const felt = useMemo(() => feltAt(beatLevel), [feltAt, beatLevel]);
  const durationSec = recording.durationSec || a.durationSec;
  // One object per grid, so what is computed from it (the steadiness report) is computed once.
  const grid = useMemo(
    () => ({ beats: felt.beats, downbeats: felt.downbeats, durationSec, originalBpm: felt.bpm, meter }),
    [felt, durationSec, meter],
  );
  const audition = useAuditionPlayer(audioUrl, grid);
  const { loop, bpm, setBpm, skip } = audition;

  // The last loop comes back after a reload; every new loop is kept as the last one.
  useEffect(() => {
    const last = readLastLoop(recording.id);
    if (last) audition.setLoop(last);
    // Once, when the player for this recording is made.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [recording.id]);
  useEffect(() => {
    if (loop) keepLastLoop(recording.id, loop);
  }, [loop, recording.id]);

  const { passages: all } = usePassages(song?.id);
  const passages = useMemo(() => (all ?? []).filter((p) => p.recordingId === recording.id), [all, recording.id]);
  const saved = loop ? (passages.find((p) => samePlace(loop, p)) ?? null) : null;
  const stepUp = useStepUpRun({
    audition,
    song,
    recordingId: recording.id,
    saved,
    canLog: canEdit,
    downbeats: felt.downbeats,
    originalBpm: felt.bpm,
  });
  const breakReminder = useBreakReminder(audition.playing);
  // Here rather than in its card, so a run survives the layout changing between phone and wide screen.
  const playAlong = usePlayAlong(audition);
  const { candidates } = useCandidates(song?.id);
  usePlayerKeys({ togglePlay: audition.togglePlay, skip, bpm, setBpm, candidateBpms: candidates?.map((c) => c.bpm) });
  const wav = useWavExport({
    audition,
    downbeats: felt.downbeats,
    name: recording.label || song?.title || recording.originalName || 'recording',
  });
  const [unit, setUnit] = useState<SnapUnit>('bar');
  const loopLabel = loop ? (saved?.name ?? describePassage(loop, felt.downbeats)) : null;
  const marked = useMemo(
    () => passages.map((p) => ({ id: p.id, name: p.name, start: p.startSec, end: p.endSec })),
    [passages],
  );
  const { notes } = useNotes(recording.id);
  const noteMarks = useMemo(
    () =>
      (notes ?? []).map((n) => ({
        id: n.id,
        start: n.atSec ?? n.startSec ?? 0,
        end: n.atSec != null ? null : (n.endSec ?? null),
      })),
    [notes],
  );
  const listen = (level: BeatLevel) => audition.listen(feltAt(level), LISTEN_SEC);
  const clearLoop = () => {
    keepLastLoop(recording.id, null);
    stepUp.changePassage(null);
  };

  return {
    a,
    noteMarks,
    felt,
    grid,
    audition,
    passages,
    saved,
    stepUp,
    breakReminder,
    playAlong,
    wav,
    unit,
    setUnit,
    loopLabel,
    marked,
    listen,
    clearLoop,
  };
}

export type AuditionSession = ReturnType<typeof useAuditionSession>;
