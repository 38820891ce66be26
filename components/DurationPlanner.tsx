// How long the piece lasts at each of its tempos, and the tempo that makes it last a target time (a picture, a
// fixed slot) or fits a number of bars into it. Beats come from a recording's measured beat count, or from
// bars × beats per bar when there is none. In compound meters the player says which note the BPM counts.
import React, { useState } from 'react';
import { View } from 'react-native';
import { Body, Card, Chip, Field, Heading, Row, Small } from './ui';
import { space } from './theme';
import { barsIn, beatName, beatsInBar, bpmToFit, secondsFor, type BeatUnit } from '@/audio/practice/duration';
import { barsFit, formatBpm, formatClock, parseClock, plural, tenth } from '@/shared/format';
import type { Recording, Song } from '@/shared/schemas';
import { feltBeatCount } from '@/audio/practice/beat-grid';

export function DurationPlanner({
  song,
  recordings,
  candidateBpms,
}: {
  song: Song;
  recordings: Recording[];
  candidateBpms: number[];
}) {
  const measured = recordings.find((r) => r.status === 'done' && r.analysis && r.analysis.beatCount > 0);
  const compound = beatsInBar(song.meter, 'felt') !== beatsInBar(song.meter, 'written');
  const [unit, setUnit] = useState<BeatUnit>('felt');
  const [bars, setBars] = useState('');
  const [target, setTarget] = useState('');
  const perBar = beatsInBar(song.meter, unit);
  // The recording's beats as the player feels them (their tempo correction and beat level), in the unit chosen.
  const measuredBeats = measured
    ? (feltBeatCount(measured.analysis!.beatCount, measured.analysis!.bpm, measured.correctedBpm, measured.beatLevel) *
        beatsInBar(song.meter, unit)) /
      beatsInBar(song.meter, 'felt')
    : null;
  const barCount = Number(bars);
  const beats = bars.trim() && barCount > 0 ? barCount * perBar : measuredBeats;
  const targetSec = parseClock(target);
  const tempos = [
    ...(song.chosenBpm ? [{ label: 'Chosen', bpm: song.chosenBpm }] : []),
    ...(song.workingBpm ? [{ label: 'Working', bpm: song.workingBpm }] : []),
    ...(song.goalBpm ? [{ label: 'Goal', bpm: song.goalBpm }] : []),
    ...candidateBpms.filter((b) => b !== song.chosenBpm).map((bpm) => ({ label: 'Candidate', bpm })),
  ];
  // The song's tempos count the felt beat; shown in written notes they are scaled the same way.
  const inUnit = (bpm: number) => (bpm * beatsInBar(song.meter, unit)) / beatsInBar(song.meter, 'felt');
  return (
    <Card testID="duration-planner">
      <Heading level={3}>How long it lasts</Heading>
      <Small>
        {beats
          ? `${plural(Math.round(beats), beatName(song.meter, unit))}${bars.trim() ? ` (${plural(barCount, 'bar')} of ${song.meter})` : measured ? ' measured in the recording' : ''}.`
          : 'Give the number of bars, or add a recording: its beats are counted.'}
      </Small>
      {compound ? (
        <Row>
          <Chip
            label={`BPM counts the ${beatName(song.meter, 'felt')}`}
            selected={unit === 'felt'}
            onPress={() => setUnit('felt')}
          />
          <Chip
            label={`BPM counts the ${beatName(song.meter, 'written')}`}
            selected={unit === 'written'}
            onPress={() => setUnit('written')}
          />
        </Row>
      ) : null}
      <Row align="flex-end">
        <Field
          label={`Bars of ${song.meter}`}
          value={bars}
          onChangeText={setBars}
          inputMode="numeric"
          placeholder={measured ? 'as recorded' : ''}
          testID="planner-bars"
        />
        <Field
          label="Target time (m:ss.s)"
          value={target}
          onChangeText={setTarget}
          placeholder="3:30.0"
          testID="planner-target"
        />
      </Row>
      {beats ? (
        <View style={{ gap: space.xs }}>
          {tempos.map((t) => (
            <Body key={`${t.label}-${t.bpm}`}>
              {t.label} {formatBpm(tenth(inUnit(t.bpm)))} BPM: {formatClock(secondsFor(beats, inUnit(t.bpm)))}
            </Body>
          ))}
          {targetSec ? (
            <View testID="planner-fit">
              <Body style={{ fontWeight: '700' }}>
                To last {formatClock(targetSec)}: {formatBpm(tenth(bpmToFit(beats, targetSec)))} BPM
                {song.chosenBpm
                  ? ` (${barsFit(tenth(barsIn(targetSec, inUnit(song.chosenBpm), perBar)))} at the chosen tempo)`
                  : ''}
              </Body>
            </View>
          ) : null}
        </View>
      ) : null}
    </Card>
  );
}
