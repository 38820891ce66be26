// The tempo curve on a beat grid built by hand: four bars of 4/4 at 100 BPM (a beat every 60 / 100 = 0.6 s)
// then four at 110 BPM (every 60 / 110 s), the definition of BPM and of a 4/4 bar being common practice.
import React from 'react';
import { render, screen } from '@testing-library/react';
import { TempoCurveChart } from '@/components/charts/TempoCurveChart';
import { reportRanges } from '@/components/SteadinessReport';
import { steadiness } from '@/audio/practice/steadiness';

function stepGrid() {
  const beats = [1];
  for (let k = 0; k < 32; k++) beats.push(beats[beats.length - 1]! + (k < 16 ? 60 / 100 : 60 / 110));
  return { beats, downbeats: beats.filter((_, i) => i % 4 === 0), durationSec: beats[beats.length - 1]! + 1 };
}

/** The vertices of an SVG path made of M and L commands. */
function vertices(d: string): { x: number; y: number }[] {
  return [...d.matchAll(/[ML]\s*(-?[\d.]+)[ ,](-?[\d.]+)/g)].map((m) => ({ x: Number(m[1]), y: Number(m[2]) }));
}

/** The y of a horizontal reference line, found by its label's group. */
function lineY(label: string): number {
  const text = screen.getByText(label);
  const group = text.closest('g')!;
  const ln = group.querySelector('line')!;
  expect(ln.getAttribute('y1')).toBe(ln.getAttribute('y2'));
  return Number(ln.getAttribute('y1'));
}

test('draws tempo by bar between the labelled chosen and goal lines, with a caption of its start and end', () => {
  const { container } = render(
    <TempoCurveChart analysis={stepGrid()} song={{ chosenBpm: 96, goalBpm: 112, workingBpm: 96 }} />,
  );

  // Bars 1–4 read 4 × 60 / 2.4 s = 100, bars 5–8 read 4 × 60 / (4 × 60/110) s = 110.
  expect(screen.getByText('Tempo by bar: starts at 100, ends at 110 (8 bars)')).toBeTruthy();

  const path = [...container.querySelectorAll('path')].find((p) => (p.getAttribute('d') ?? '').startsWith('M'));
  const points = vertices(path!.getAttribute('d')!);
  expect(points).toHaveLength(8);

  // Equal chosen and working tempos share one line; the goal has its own.
  const chosen = lineY('chosen · working 96');
  const goal = lineY('goal 112');
  expect(goal).toBeLessThan(chosen); // SVG y grows downward: the faster tempo is higher up.
  // 100 and 110 both lie between 96 and 112, and the second half is drawn higher than the first.
  for (const p of points) {
    expect(p.y).toBeLessThan(chosen);
    expect(p.y).toBeGreaterThan(goal);
  }
  expect(points[4]!.y).toBeLessThan(points[3]!.y);
  // On a linear scale the heights are in proportion: (110 − 100) / (112 − 96) of the lines' distance.
  expect((points[3]!.y - points[4]!.y) / (chosen - goal)).toBeCloseTo(10 / 16, 1);
  // Bars run left to right.
  for (let i = 1; i < points.length; i++) expect(points[i]!.x).toBeGreaterThan(points[i - 1]!.x);

  expect(screen.getByRole('img').getAttribute('aria-label')).toBe(
    'Tempo by bar: starts at 100, ends at 110 (8 bars). Lines: chosen · working 96, goal 112.',
  );
});

test('without beats, without an analysis, or with a single bar it says so instead of drawing a curve', () => {
  const { rerender } = render(<TempoCurveChart analysis={{ beats: [], downbeats: [], durationSec: 30 }} song={null} />);
  expect(screen.getByText(/no tempo curve to draw/)).toBeTruthy();
  expect(screen.queryByRole('img')).toBeNull();

  rerender(<TempoCurveChart analysis={null} song={null} />);
  expect(screen.getByText(/once the analysis is done/)).toBeTruthy();

  // One bar of four beats at 0.5 s (120 BPM): the last bar is measured over its own three intervals.
  rerender(
    <TempoCurveChart
      analysis={{ beats: [0.2, 0.7, 1.2, 1.7], downbeats: [0.2], durationSec: 2 }}
      song={{ chosenBpm: null, goalBpm: 130, workingBpm: null }}
    />,
  );
  expect(screen.getByText('Tempo by bar: one bar, at 120')).toBeTruthy();
  expect(screen.getByText('goal 130')).toBeTruthy();
});

test('a ten-minute take keeps bar numbers apart and evenly spaced and the path no heavier than the chart is wide', () => {
  // 300 bars of 4/4 at 120 BPM (2 s a bar) with a slow wobble, as a long live take might have.
  const beats: number[] = [];
  let t = 0.5;
  for (let k = 0; k <= 1200; k++) {
    beats.push(t);
    t += 60 / (120 + 3 * Math.sin(k / 40));
  }
  const { container } = render(
    <TempoCurveChart
      analysis={{ beats, downbeats: beats.filter((_, i) => i % 4 === 0), durationSec: t }}
      song={{ chosenBpm: 120, goalBpm: null, workingBpm: null }}
    />,
  );
  const path = [...container.querySelectorAll('path')].find((p) => (p.getAttribute('d') ?? '').startsWith('M'))!;
  // The chart draws 320 px wide before it is measured: at most one vertex per 2 px column pair of min and max.
  // 300 bars on a plot narrower than 320 px are thinned: fewer vertices than bars, never more than the width.
  const drawn = vertices(path.getAttribute('d')!).length;
  expect(drawn).toBeLessThan(300);
  expect(drawn).toBeLessThanOrEqual(320);
  // Tick labels along x: whole bar numbers, each label's centre at least its width plus a gap from the next.
  const xLabels = [...container.querySelectorAll('text')].filter(
    (el) => el.getAttribute('text-anchor') === 'middle' && /^\d+$/.test(el.textContent ?? ''),
  );
  expect(xLabels.length).toBeGreaterThanOrEqual(2);
  const xs = xLabels.map((el) => Number(el.getAttribute('x')));
  for (let i = 1; i < xs.length; i++) expect(xs[i]! - xs[i - 1]!).toBeGreaterThan(3 * 12 * 0.6);
  // Evenly spaced, counted from bar 1 by a power of two (phrases of 4 and 8 bars, common practice): 1, 65, 129 …
  const bars = xLabels.map((el) => Number(el.textContent));
  const step = bars[1]! - bars[0]!;
  expect(bars[0]).toBe(1);
  expect(Math.log2(step) % 1).toBe(0);
  bars.forEach((b, i) => expect(b).toBe(1 + i * step));
});

test('with the steadiness report on it: a smoothed line with a gap at the marked bars, and labelled bands', () => {
  // The step grid (bars 1–4 at 100, 5–8 at 110) with bars 3–4 marked rubato: the report smooths bars 1, 2, 5–8
  // and leaves 3–4 out, so its line breaks there; bar 5 onward runs 10 % faster than the chosen 100.
  const grid = stepGrid();
  const report = steadiness(grid, {
    referenceBpm: 100,
    intended: [{ kind: 'rubato', startSec: grid.downbeats[2]!, endSec: grid.downbeats[4]! }],
  });
  expect(report.bars.filter((b) => b.intended).map((b) => b.bar)).toEqual([3, 4]);
  render(
    <TempoCurveChart
      analysis={grid}
      song={{ chosenBpm: 100, goalBpm: null, workingBpm: null }}
      overlay={{ smoothed: { label: 'smoothed over 3 bars', bars: report.smoothed }, ranges: reportRanges(report) }}
    />,
  );
  const smoothed = screen.getByTestId('series-smoothed').getAttribute('d')!;
  // d3's line starts a new M at each undefined point: bars 1–2, then 5–8.
  expect(smoothed.match(/M/g)).toHaveLength(2);
  expect(screen.getByText('rubato')).toBeTruthy();
  expect(screen.getByText('rushes')).toBeTruthy();
  expect(screen.getByText('smoothed over 3 bars')).toBeTruthy();
});
