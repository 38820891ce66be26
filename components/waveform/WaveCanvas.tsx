// A window [from, to] of a recording's waveform at the width it is given: the peaks as one SVG path, beat and bar
// lines thinned by gridMarks (view.ts) and bar numbers that never overlap. Drawn again only when the window, the
// width or the grid change.
import React, { memo, useMemo } from 'react';
import { Text, View } from 'react-native';
import Svg, { Path } from 'react-native-svg';
import { colors, fonts } from '@/components/theme';
import { columnsOf, gridMarks, LABEL_OFFSET_PX, type PeakLevel } from './view';
import { plural } from '@/shared/format';

/** Height of the strip above the waveform that carries the bar numbers. */
export const LABEL_STRIP = 14;
/** One column every 2 px: finer than a phone's eye separates, half the path of one per pixel. */
const PX_PER_COLUMN = 2;

export const WaveCanvas = memo(function WaveCanvas({
  levels,
  from,
  to,
  width,
  height,
  beats,
  downbeats,
  showLabels = true,
  testID,
}: {
  levels: PeakLevel[];
  from: number;
  to: number;
  width: number;
  height: number;
  beats: number[];
  downbeats: number[];
  showLabels?: boolean;
  testID?: string;
}) {
  const top = showLabels ? LABEL_STRIP : 0;
  const wave = useMemo(() => {
    const n = Math.max(1, Math.floor(width / PX_PER_COLUMN));
    const cols = columnsOf(levels, from, to, n);
    const peak = Math.max(0.05, ...cols.map((c) => Math.max(-c.lo, c.hi)));
    const mid = height / 2;
    // One closed outline: the maxima left to right, the minima back.
    const upper = cols.map((c, i) => `${i === 0 ? 'M' : 'L'}${(i * width) / n} ${mid - (c.hi / peak) * mid}`).join('');
    const lower = cols
      .map((c, i) => `L${((n - 1 - i) * width) / n} ${mid - (cols[n - 1 - i]!.lo / peak) * mid + 0.5}`)
      .join('');
    return `${upper}${lower}Z`;
  }, [levels, from, to, width, height]);
  const marks = useMemo(() => gridMarks(beats, downbeats, from, to, width), [beats, downbeats, from, to, width]);
  const beatPath = marks.beats.map((x) => `M${x} 0V${height}`).join('');
  const barPath = marks.bars.map((b) => `M${b.x} 0V${height}`).join('');
  return (
    <View
      testID={testID}
      style={{ width, height: height + top }}
      accessibilityLabel={`Waveform, bars numbered every ${marks.labelEvery === 1 ? 'bar' : plural(marks.labelEvery, 'bar')}`}
    >
      <View style={{ position: 'absolute', top, left: 0 }}>
        <Svg width={width} height={height}>
          <Path d={wave} fill={colors.teal} opacity={0.75} />
          {beatPath ? <Path d={beatPath} stroke={colors.ink} strokeWidth={1} opacity={0.35} /> : null}
          {barPath ? <Path d={barPath} stroke={colors.amber} strokeWidth={2} opacity={0.9} /> : null}
        </Svg>
      </View>
      {showLabels
        ? marks.labels.map((l) => (
            <Text
              key={l.bar}
              testID={`bar-number-${l.bar}`}
              style={{
                position: 'absolute',
                top: 0,
                left: l.x + LABEL_OFFSET_PX,
                fontFamily: fonts.bodyMedium,
                fontSize: 10,
                lineHeight: LABEL_STRIP,
                color: colors.amber,
              }}
            >
              {l.bar}
            </Text>
          ))
        : null}
    </View>
  );
});
