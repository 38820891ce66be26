// The live view of a player at the instrument, one component for recording against the click (RecordPanel) and
// playing along with a reference (audition/PlayAlongCard): the state in large type on its colour, readable from
// a music stand; the running tempo of the last beats against the target there; and the last beats as ticks on a
// lane whose centre is the beat (early to the left, late to the right), each with its offset in ms.
import React from 'react';
import { Text, View } from 'react-native';
import { Small } from './ui';
import { colors, radius, space, type } from './theme';
import { RUNNING_INTERVALS, type BeatMark, type PlayState } from '@/audio/live/feedback';
import { formatBpm, formatOffsetMs, plural, tenth } from '@/shared/format';

/** Marks shown at once: two bars of 4/4, the window of the running tempo. */
const SHOWN_MARKS = 8;
/** The lane's half-width in ms: offsets beyond it sit at its edge (a quarter of a beat at 150 BPM). */
const LANE_MS = 100;

export const stateWords: Record<PlayState, { label: string; colour: string; soft: string }> = {
  steady: { label: 'Steady', colour: colors.teal, soft: colors.tealSoft },
  rushing: { label: 'Rushing', colour: colors.amber, soft: colors.amberSoft },
  dragging: { label: 'Dragging', colour: colors.danger, soft: colors.dangerSoft },
};

/** Where a beat is in the music, as the player counts it. */
export interface BeatPlace {
  bar: number;
  beat: number;
}

export function LiveBeatView({
  marks,
  placeOf,
  beatWord = 'click',
}: {
  marks: BeatMark[];
  placeOf: (m: BeatMark) => BeatPlace;
  /** What the centre line is called: the click, or the reference's beat. */
  beatWord?: string;
}) {
  const latest = marks[marks.length - 1];
  const words = latest ? stateWords[latest.state] : null;
  const counted = Math.min(RUNNING_INTERVALS, marks.length - 1);
  return (
    <View style={{ gap: space.sm }} testID="live-view">
      <View
        style={{
          backgroundColor: words?.soft ?? colors.paper,
          borderLeftWidth: 8,
          borderLeftColor: words?.colour ?? colors.line,
          borderRadius: radius.md,
          paddingVertical: space.md,
          paddingHorizontal: space.lg,
          gap: space.xs,
        }}
      >
        <Text style={[type.tempo, { color: words?.colour ?? colors.muted }]} testID="live-state" aria-live="polite">
          {words?.label ?? 'Listening…'}
        </Text>
        <Text style={[type.label, { color: colors.ink }]} testID="live-bpm">
          {latest?.bpm
            ? `${formatBpm(tenth(latest.bpm))} BPM over the last ${plural(counted, 'beat')} · target ${formatBpm(tenth(latest.targetBpm))} BPM`
            : 'Play on the beat: the first beats set the running tempo.'}
        </Text>
      </View>
      <OffsetLane marks={marks.slice(-SHOWN_MARKS)} placeOf={placeOf} beatWord={beatWord} />
    </View>
  );
}

/** The last beats as ticks on a lane: the centre line is the beat, early to the left, late to the right. */
function OffsetLane({
  marks,
  placeOf,
  beatWord,
}: {
  marks: BeatMark[];
  placeOf: (m: BeatMark) => BeatPlace;
  beatWord: string;
}) {
  return (
    <View style={{ gap: space.xs, maxWidth: 640 }} testID="live-marks">
      <View style={{ flexDirection: 'row', gap: space.sm }}>
        <View style={{ width: 64 }} />
        <View style={{ flex: 1, flexDirection: 'row', justifyContent: 'space-between' }}>
          <Small>◂ early</Small>
          <Small>{beatWord}</Small>
          <Small>late ▸</Small>
        </View>
        <View style={{ width: 64 }} />
      </View>
      {marks.map((m) => {
        const x = Math.max(-1, Math.min(1, m.offsetMs / LANE_MS));
        const words = m.offsetMs < 0 ? 'early' : 'late';
        const at = placeOf(m);
        return (
          <View
            key={m.beat}
            testID="live-mark"
            aria-label={`Bar ${at.bar}, beat ${at.beat}: ${Math.round(Math.abs(m.offsetMs))} ms ${words}, ${m.state}`}
            style={{ flexDirection: 'row', alignItems: 'center', gap: space.sm }}
          >
            <Text style={[type.small, { color: colors.muted, width: 64 }]}>
              {at.bar}.{at.beat}
            </Text>
            <View
              style={{
                flex: 1,
                height: 14,
                backgroundColor: colors.tealSoft,
                borderRadius: radius.sm,
                overflow: 'hidden',
              }}
            >
              <View
                style={{ position: 'absolute', left: '50%', top: 0, bottom: 0, width: 1, backgroundColor: colors.ink }}
              />
              <View
                style={{
                  position: 'absolute',
                  left: `${50 + x * 48}%`,
                  top: 1,
                  width: 6,
                  height: 12,
                  marginLeft: -3,
                  borderRadius: 3,
                  backgroundColor: stateWords[m.state].colour,
                }}
              />
            </View>
            <Text style={[type.small, { color: colors.ink, width: 64, textAlign: 'right' }]}>
              {formatOffsetMs(m.offsetMs)}
            </Text>
          </View>
        );
      })}
    </View>
  );
}
