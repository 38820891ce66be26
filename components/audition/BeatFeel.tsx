// "The beat you feel": one control for the grid the player hears. The metrical level (half / as found / double,
// each with its BPM; the grid and the click move with it), tapping along, "this beat is one" and a nudge earlier
// or later. Choices are kept on the recording (beatLevel, barOneSec, nudgeMs); audio/practice/beat-grid.ts applies
// them.
import React, { useRef, useState } from 'react';
import { Text, View } from 'react-native';
import { Button, Chip, Notice, Row, Small } from '@/components/ui';
import { colors, space, type } from '@/components/theme';
import { correctRecording } from '@/client/hooks';
import { LEVEL_FACTOR, nearestIndex, relationInWords, type BeatLevel } from '@/audio/practice/beat-grid';
import { tapTempo } from '@/audio/practice/tap-tempo';
import { formatBpm, tenth } from '@/shared/format';
import type { Analysis, Recording } from '@/shared/schemas';

/** A nudge step of 10 ms: about the smallest offset between a click and the music a player notices (from memory:
 * asynchronies of 10–20 ms are heard in tapping studies). */
const NUDGE_STEP_MS = 10;
/** A pause of over two seconds between taps starts a new count. */
const TAP_RESET_SEC = 2;
/** A tapped tempo within 6 % of a level's is that level: tapping wavers by a few percent (from memory). */
const TAP_MATCH = 0.06;

const LEVELS: { level: BeatLevel; name: string }[] = [
  { level: 'half', name: 'Half' },
  { level: 'as-found', name: 'As found' },
  { level: 'double', name: 'Double' },
];

/** The ambiguity flag an analysis may carry (optional: not every engine version writes it). */

export function BeatFeel({
  recording,
  analysis,
  beats,
  getPosition,
  canEdit,
  onListen,
}: {
  recording: Recording;
  analysis: Analysis;
  /** The felt grid's beats (nudge included), to find the beat under the playhead. */
  beats: number[];
  getPosition: () => number;
  canEdit: boolean;
  /** A short listen with the click at a level, before choosing it. */
  onListen: (level: BeatLevel) => void;
}) {
  const base = recording.originalBpm!;
  const level = recording.beatLevel;
  const feltBpm = tenth(base * LEVEL_FACTOR[level]);
  const [problem, setProblem] = useState<string | null>(null);
  const patch = (p: Parameters<typeof correctRecording>[1]) =>
    correctRecording(recording.id, p).then(
      () => setProblem(null),
      (e: Error) => setProblem(e.message),
    );

  const taps = useRef<number[]>([]);
  const [tapped, setTapped] = useState<number | null>(null);
  const tap = () => {
    const now = performance.now() / 1000;
    if (taps.current.length && now - taps.current[taps.current.length - 1]! > TAP_RESET_SEC) taps.current = [];
    taps.current.push(now);
    setTapped(tapTempo(taps.current)?.bpm ?? null);
  };
  const tappedLevel =
    tapped === null
      ? null
      : (LEVELS.find((l) => Math.abs(tapped / (base * LEVEL_FACTOR[l.level]) - 1) < TAP_MATCH)?.level ?? null);

  const thisBeatIsOne = () => {
    const i = nearestIndex(beats, getPosition());
    if (i < 0) return;
    // Kept without the nudge, so a later nudge moves bar 1 with every other beat.
    void patch({ barOneSec: Math.max(0, beats[i]! - recording.nudgeMs / 1000) });
  };
  const nudge = (by: number) => void patch({ nudgeMs: Math.max(-500, Math.min(500, recording.nudgeMs + by)) });

  const ambiguous = analysis.levelAmbiguous;
  const found = analysis.bpm ?? base;
  // Other tempos the engine heard that are not a level of this one: named by how they relate ("two thirds").
  const others = analysis.candidates
    .filter((c) => c.relation === 'three-halves' || c.relation === 'two-thirds')
    .map((c) => ({ bpm: tenth(c.bpm), words: relationInWords(c.bpm / found) }))
    .filter((c) => c.words !== null && c.bpm >= 30 && c.bpm <= 300);
  const changed =
    level !== 'as-found' || recording.barOneSec !== null || recording.nudgeMs !== 0 || recording.correctedBpm !== null;

  return (
    <View style={{ gap: space.md }} testID="beat-feel">
      {ambiguous ? (
        <View style={{ gap: space.xs }} testID="level-question">
          <Notice tone="caution">
            Does it feel like {formatBpm(tenth(base / 2))} or {formatBpm(tenth(base))}? Both fit this recording: listen
            to each with its click, then pick the one you would tap your foot to.
          </Notice>
          <Row>
            <Chip
              label={`Listen at ${formatBpm(tenth(base / 2))}`}
              onPress={() => onListen('half')}
              testID="listen-half"
            />
            <Chip
              label={`Listen at ${formatBpm(tenth(base))}`}
              onPress={() => onListen('as-found')}
              testID="listen-as-found"
            />
          </Row>
        </View>
      ) : null}
      <View style={{ gap: space.xs }}>
        <Text style={[type.label, { color: colors.ink }]}>The beat is</Text>
        <Row>
          {LEVELS.map((l) => (
            <Chip
              key={l.level}
              testID={`level-${l.level}`}
              label={`${l.name} · ${formatBpm(tenth(base * LEVEL_FACTOR[l.level]))}`}
              hint={`${l.name}: ${formatBpm(tenth(base * LEVEL_FACTOR[l.level]))} BPM`}
              selected={level === l.level}
              disabled={!canEdit}
              onPress={() => void patch({ beatLevel: l.level })}
            />
          ))}
        </Row>
        <Small>
          Half counts every other beat, double puts a beat between each pair; the grid, the bar numbers and the click
          follow.
        </Small>
      </View>

      <View style={{ gap: space.xs }}>
        <Text style={[type.label, { color: colors.ink }]}>Where the bar starts</Text>
        <Row>
          <Button
            label="This beat is one"
            kind="secondary"
            disabled={!canEdit}
            onPress={thisBeatIsOne}
            testID="beat-is-one"
          />
          <Chip
            label="◂ Earlier"
            hint={`Move the grid ${NUDGE_STEP_MS} ms earlier`}
            disabled={!canEdit}
            onPress={() => nudge(-NUDGE_STEP_MS)}
            testID="nudge-earlier"
          />
          <Chip
            label="Later ▸"
            hint={`Move the grid ${NUDGE_STEP_MS} ms later`}
            disabled={!canEdit}
            onPress={() => nudge(NUDGE_STEP_MS)}
            testID="nudge-later"
          />
          <Small>
            {recording.nudgeMs === 0
              ? 'Grid as found'
              : `Grid ${Math.abs(recording.nudgeMs)} ms ${recording.nudgeMs < 0 ? 'earlier' : 'later'}`}
          </Small>
        </Row>
        <Small>
          Put the playhead on the beat you count as one (play and pause, or tap the waveform), then press “This beat is
          one”.
        </Small>
      </View>

      <View style={{ gap: space.xs }}>
        <Text style={[type.label, { color: colors.ink }]}>Tap along</Text>
        <Row>
          <Button label="Tap the beat" kind="secondary" onPress={tap} testID="tap" />
          {tapped === null ? (
            <Small>Four taps or more.</Small>
          ) : (
            <>
              <Small>
                You tap {formatBpm(tenth(tapped))} BPM
                {tappedLevel ? ` — that is ${LEVELS.find((l) => l.level === tappedLevel)!.name.toLowerCase()}` : ''}.
              </Small>
              {canEdit && tappedLevel && tappedLevel !== level ? (
                <Button
                  label={`Use ${LEVELS.find((l) => l.level === tappedLevel)!.name.toLowerCase()}`}
                  kind="quiet"
                  onPress={() => void patch({ beatLevel: tappedLevel })}
                />
              ) : null}
              {canEdit && !tappedLevel ? (
                <Button
                  label={`Use ${formatBpm(tenth(tapped))} BPM`}
                  kind="quiet"
                  onPress={() => void patch({ beatLevel: 'as-found', correctedBpm: tenth(tapped) })}
                />
              ) : null}
            </>
          )}
        </Row>
      </View>

      {others.length > 0 && canEdit ? (
        <Row>
          <Small>Also heard:</Small>
          {others.map((o) => (
            <Chip
              key={o.bpm}
              label={`${formatBpm(o.bpm)} (${o.words})`}
              hint={`Use ${formatBpm(o.bpm)} BPM, ${o.words} the tempo found`}
              onPress={() => void patch({ beatLevel: 'as-found', correctedBpm: o.bpm })}
            />
          ))}
        </Row>
      ) : null}
      {canEdit && changed ? (
        <Button
          label={`Back to the grid as found (${formatBpm(tenth(found))} BPM)`}
          kind="quiet"
          testID="grid-as-found"
          onPress={() => void patch({ beatLevel: 'as-found', barOneSec: null, nudgeMs: 0, correctedBpm: null })}
        />
      ) : null}
      {problem ? <Notice tone="error">{problem}</Notice> : null}
      <Small>Now {formatBpm(feltBpm)} BPM.</Small>
    </View>
  );
}
