// A recording's waveform from its peaks, with the beat grid over it (downbeats stronger, bar numbers above).
import React from 'react';
import { Text, View } from 'react-native';
import { colors, fonts } from './theme';
import { plural } from '@/shared/format';

export function Waveform({
  minMax,
  durationSec,
  beats = [],
  downbeats = [],
  height = 96,
  testID,
}: {
  minMax: number[];
  durationSec: number;
  beats?: number[];
  downbeats?: number[];
  height?: number;
  testID?: string;
}) {
  const buckets = minMax.length / 2;
  // Draw at most ~240 columns: a phone is narrower than the data.
  const columns = Math.min(240, buckets);
  const per = buckets / columns;
  const cols: { lo: number; hi: number }[] = [];
  for (let c = 0; c < columns; c++) {
    let lo = 0;
    let hi = 0;
    for (let b = Math.floor(c * per); b < Math.floor((c + 1) * per); b++) {
      lo = Math.min(lo, minMax[2 * b]!);
      hi = Math.max(hi, minMax[2 * b + 1]!);
    }
    cols.push({ lo, hi });
  }
  const peak = Math.max(0.05, ...cols.map((c) => Math.max(-c.lo, c.hi)));
  const downSet = new Set(downbeats.map((d) => Math.round(d * 100)));
  // Number every bar while they are few, every second or fourth when they would crowd a phone's width.
  const labelEvery = downbeats.length <= 12 ? 1 : downbeats.length <= 24 ? 2 : 4;
  return (
    <View testID={testID} accessibilityLabel={`Waveform with ${plural(beats.length, 'beat')}`} style={{ height: height + 16, width: '100%' }}>
      <View style={{ position: 'absolute', top: 16, left: 0, right: 0, height, flexDirection: 'row', alignItems: 'center' }}>
        {cols.map((c, i) => (
          <View key={i} style={{ flex: 1, alignItems: 'center', justifyContent: 'center', height }}>
            <View
              style={{
                width: '70%',
                height: Math.max(1, ((c.hi - c.lo) / (2 * peak)) * height),
                backgroundColor: colors.teal,
                opacity: 0.75,
                borderRadius: 1,
              }}
            />
          </View>
        ))}
      </View>
      {beats.map((t, i) => {
        const down = downSet.has(Math.round(t * 100));
        const bar = down ? downbeats.findIndex((d) => Math.round(d * 100) === Math.round(t * 100)) + 1 : 0;
        return (
          <View key={i} style={{ position: 'absolute', left: `${(t / durationSec) * 100}%`, top: down ? 0 : 16, height: down ? height + 16 : height }}>
            <View style={{ width: down ? 2 : 1, flex: 1, backgroundColor: down ? colors.amber : colors.ink, opacity: down ? 0.9 : 0.45 }} />
            {down && (bar - 1) % labelEvery === 0 ? (
              <Text style={{ position: 'absolute', top: 0, left: 3, fontFamily: fonts.bodyMedium, fontSize: 10, color: colors.amber }}>{bar}</Text>
            ) : null}
          </View>
        );
      })}
    </View>
  );
}
