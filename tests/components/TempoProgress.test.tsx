import React from 'react';
import { render, screen } from '@testing-library/react';
import { TempoProgress } from '@/components/TempoProgress';

test('shows the working tempo as a share of the goal', () => {
  render(<TempoProgress title="Copperline Reel" working={88} goal={112} />);
  // 88 / 112 = 0.7857 → 79 %
  expect(screen.getByText('88 of 112 BPM (79 %)')).toBeTruthy();
});

test('says so when there is no working tempo yet', () => {
  render(<TempoProgress title="Copperline Reel" working={null} goal={112} />);
  expect(screen.getByText('Goal 112 BPM — no working tempo yet')).toBeTruthy();
});
