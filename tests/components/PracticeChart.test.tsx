// The tempo-over-days chart's time axis: it shows the days practised and the week before them, never days that
// have not come yet.
import React from 'react';
import { render } from '@testing-library/react';
import { PracticeChart } from '@/components/charts/PracticeChart';
import { formatDayNumber } from '@/shared/format';
import type { LoggedSession } from '@/audio/practice/practice-log';

const session = (createdAt: string, reachedBpm: number): LoggedSession => ({
  songId: 's',
  passageId: null,
  passage: null,
  startBpm: reachedBpm - 6,
  reachedBpm,
  clean: true,
  minutes: 20,
  createdAt,
});

test('four sessions on one afternoon: the day axis ends that day and reaches a week back', () => {
  // 2 December 2026, an afternoon in UTC (the test runs with TZ=UTC, so the local day is the UTC day).
  const sessions = ['12:40', '13:10', '15:00', '16:42'].map((t, i) => session(`2026-12-02T${t}:00Z`, 96 + 2 * i));
  const { container } = render(
    <PracticeChart title="Saltmarsh Stomp" sessions={sessions} tempos={{ workingBpm: 108, goalBpm: 124 }} />,
  );
  const ticks = [...container.querySelectorAll('text')].map((t) => t.textContent);
  const day = (iso: string) => Date.parse(iso) / 86_400_000;
  const after = [1, 2, 3, 4, 5, 6, 7].map((n) => formatDayNumber(day('2026-12-02') + n));
  const before = [1, 2, 3, 4, 5, 6, 7].map((n) => formatDayNumber(day('2026-12-02') - n));
  for (const label of after) expect(ticks).not.toContain(label);
  // The week before is on the axis, so the one day's dots do not stretch across the chart.
  expect(ticks.filter((t) => before.includes(t ?? '')).length).toBeGreaterThanOrEqual(1);
});
