// The audition player on the recording screen, laid out: the waveform (overview and zoomable detail) with the
// beat grid as the player feels it, the transport, the tempo control, playing along with live feedback, the beat
// you feel, candidate tempos, saved passages and the loop with step-up practice, the levels of click and music,
// and export as WAV. On a phone a compact transport stays on screen above the navigation; on a wide screen the
// waveform and transport stay in view while the side column scrolls. A teacher on a phone, reading a student's
// recording, finds the notes first (above the player; the compact transport still plays from them), since writing
// and reading notes is what they came for; the player's own view keeps the player first. What each part does
// lives in audition/: the session hook joins them, the cards draw them.
import React from 'react';
import { useWindowDimensions, View } from 'react-native';
import { layout, space } from './theme';
import { useAuditionSession } from '@/components/audition/useAuditionSession';
import {
  BeatFeelCard,
  CandidatesCard,
  CompactTransportBar,
  LevelsAndExport,
  NotesCard,
  PassagesCard,
  PlayerCard,
  SteadinessCard,
} from '@/components/audition/AuditionCards';
import { PlayAlongCard } from '@/components/audition/PlayAlongCard';
import type { PeaksDto, Recording, Song } from '@/shared/schemas';

export function AuditionPanel({
  recording,
  song,
  peaks,
  canEdit,
  audioUrl,
}: {
  recording: Recording;
  song: Song | undefined;
  peaks: PeaksDto | undefined;
  canEdit: boolean;
  audioUrl: string;
}) {
  const wide = useWindowDimensions().width >= layout.wideFrom;
  const s = useAuditionSession({ recording, song, canEdit, audioUrl });
  const player = <PlayerCard s={s} peaks={peaks} song={song} wide={wide} />;
  const beatFeel = <BeatFeelCard s={s} recording={recording} canEdit={canEdit} />;
  const passages = <PassagesCard s={s} song={song} recording={recording} canEdit={canEdit} />;
  const candidates = <CandidatesCard s={s} song={song} canEdit={canEdit} wide={wide} />;
  const steadiness = <SteadinessCard s={s} recording={recording} song={song} canEdit={canEdit} />;
  const playAlong = <PlayAlongCard s={s} song={song} />;
  const notes = <NotesCard s={s} recording={recording} />;
  // Someone who may write notes but not change the recording: the player's teacher.
  const teacherReading = !canEdit && recording.permissions.note;

  if (wide) {
    // The player column keeps the waveform and transport at the top of the view; the side column scrolls past.
    return (
      <View style={{ flexDirection: 'row', gap: space.lg }}>
        <View style={{ flex: 3, gap: space.lg }}>
          {player}
          {notes}
          {steadiness}
          {beatFeel}
        </View>
        <View style={{ flex: 2, gap: space.lg }}>
          {/* Beside the player that stays in view, not under it: the live state is read while playing. */}
          {playAlong}
          {passages}
          {candidates}
          <LevelsAndExport s={s} />
        </View>
      </View>
    );
  }
  return (
    <View style={{ gap: space.lg }}>
      {teacherReading ? notes : null}
      {player}
      {playAlong}
      {teacherReading ? null : notes}
      {steadiness}
      {passages}
      {candidates}
      {beatFeel}
      <LevelsAndExport s={s} />
      <CompactTransportBar s={s} />
    </View>
  );
}
