import React from 'react';
import { Pressable, View } from 'react-native';
import { Body, Small } from './ui';
import { ProgressBar } from './ProgressBar';
import { colors, radius, space } from './theme';
import { formatBpm, formatDuration, tenth } from '@/shared/format';
import type { Recording } from '@/shared/schemas';

const statusText: Record<Recording['status'], string> = {
  queued: 'Waiting to be analysed',
  running: 'Finding the tempo…',
  done: '',
  failed: 'Analysis failed',
};

export function RecordingRow({ recording: r, onOpen }: { recording: Recording; onOpen: () => void }) {
  return (
    <Pressable
      role="link"
      onPress={onOpen}
      testID="recording-row"
      style={{
        padding: space.md,
        borderRadius: radius.sm,
        borderWidth: 1,
        borderColor: colors.line,
        backgroundColor: colors.card,
        gap: space.xs,
      }}
    >
      <View style={{ flexDirection: 'row', justifyContent: 'space-between', gap: space.sm }}>
        <Body style={{ fontWeight: '700', flexShrink: 1 }}>{r.label || r.originalName || 'Untitled recording'}</Body>
        <Body style={{ color: colors.amber, fontWeight: '700' }}>
          {r.status === 'done' && r.originalBpm ? `${formatBpm(tenth(r.originalBpm))} BPM` : ''}
        </Body>
      </View>
      <Small>
        {r.kind === 'take' ? 'Take' : 'Reference'} · {r.format.toUpperCase()} · {formatDuration(r.durationSec)}
        {r.status !== 'done' ? ` · ${statusText[r.status]}` : r.analysis?.meter ? ` · ${r.analysis.meter}` : ''}
      </Small>
      {r.status === 'running' || r.status === 'queued' ? (
        <ProgressBar value={r.progress} label="Analysis progress" />
      ) : null}
      {r.status === 'failed' && r.error ? <Small muted={false}>{r.error}</Small> : null}
    </Pressable>
  );
}
