import React from 'react';
import { View } from 'react-native';
import { Body, Card, Small } from './ui';
import { colors, radius } from './theme';
import { formatBpm } from '@/shared/format';

/** How far the working tempo has come toward the goal, as a share of the goal. */
export function TempoProgress({
  title,
  working,
  goal,
  children,
}: {
  title: string;
  working: number | null;
  goal: number;
  children?: React.ReactNode;
}) {
  const share = working ? Math.min(1, working / goal) : 0;
  return (
    <Card>
      <Body style={{ fontWeight: '700' }}>{title}</Body>
      <View style={{ height: 10, backgroundColor: colors.tealSoft, borderRadius: radius.sm, overflow: 'hidden' }}>
        <View style={{ width: `${share * 100}%`, height: '100%', backgroundColor: colors.teal }} />
      </View>
      <Small>
        {working
          ? `${formatBpm(working)} of ${formatBpm(goal)} BPM (${Math.round(share * 100)} %)`
          : `Goal ${formatBpm(goal)} BPM — no working tempo yet`}
      </Small>
      {children}
    </Card>
  );
}

/** The bar alone: working tempo as a share of the goal, with the figures in words beside it. */
export function ProgressToGoal({ working, goal }: { working: number | null; goal: number }) {
  const share = working ? Math.min(1, working / goal) : 0;
  return (
    <View
      style={{ gap: 2 }}
      accessibilityLabel={working ? `${formatBpm(working)} of ${formatBpm(goal)} BPM` : `goal ${formatBpm(goal)} BPM`}
    >
      <View style={{ height: 8, backgroundColor: colors.tealSoft, borderRadius: radius.sm, overflow: 'hidden' }}>
        <View style={{ width: `${share * 100}%`, height: '100%', backgroundColor: colors.teal }} />
      </View>
      <Small>
        {working
          ? `${formatBpm(working)} of ${formatBpm(goal)} BPM (${Math.round(share * 100)} %)`
          : `Goal ${formatBpm(goal)} BPM, no working tempo yet`}
      </Small>
    </View>
  );
}
