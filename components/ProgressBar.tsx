import React from 'react';
import { View } from 'react-native';
import { colors, radius } from './theme';

export function ProgressBar({ value, label, testID }: { value: number; label: string; testID?: string }) {
  const pct = Math.round(Math.max(0, Math.min(1, value)) * 100);
  return (
    <View
      role="progressbar"
      aria-valuenow={pct}
      aria-valuemin={0}
      aria-valuemax={100}
      aria-label={label}
      testID={testID}
      style={{ height: 10, backgroundColor: colors.tealSoft, borderRadius: radius.sm, overflow: 'hidden' }}
    >
      <View style={{ width: `${pct}%`, height: '100%', backgroundColor: colors.teal }} />
    </View>
  );
}
