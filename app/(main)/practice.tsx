// Practice: the week in numbers with the log's export, progress toward each goal tempo with the latest sessions
// of the log, and a plain metronome.
import React from 'react';
import { EmptyState, Heading, Screen, Notice } from '@/components/ui';
import { useSongs } from '@/client/hooks';
import { TempoProgress } from '@/components/TempoProgress';
import { PracticeLog } from '@/components/PracticeLog';
import { MetronomePanel } from '@/components/MetronomePanel';
import { WeekSummary } from '@/components/WeekSummary';
import { ScreenTitle } from '@/components/ScreenTitle';

export default function Practice() {
  const { songs } = useSongs();
  const withGoal = songs?.filter((s) => s.goalBpm) ?? [];
  return (
    <Screen testID="practice">
      <ScreenTitle title="Practice" />
      <Heading>Practice</Heading>
      <WeekSummary />
      {withGoal.length === 0 ? (
        <EmptyState title="Nothing to practise toward yet">
          Give a song a goal tempo and a working tempo in your library. Your progress from one to the other shows here,
          session by session.
        </EmptyState>
      ) : (
        withGoal.map((s) => (
          <TempoProgress key={s.id} title={s.title} working={s.workingBpm} goal={s.goalBpm!}>
            <PracticeLog songId={s.id} limit={3} />
          </TempoProgress>
        ))
      )}
      <MetronomePanel />
      <Notice tone="caution">
        Long, repetitive practice strains hands, arms and ears. Warm up, take short breaks (the player suggests one
        after 45 minutes without a real pause), and stop if anything hurts; your teacher or a health professional can
        advise you on a routine that suits you.
      </Notice>
    </Screen>
  );
}
