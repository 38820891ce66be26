// The plotting layer on its own: what the steadiness report will need of it (shaded x-ranges with their words,
// reference lines close together still readable) and the arithmetic of a linear scale.
import React from 'react';
import { render, screen } from '@testing-library/react';
import { LineChart } from '@/components/charts/LineChart';

const points = [1, 2, 3, 4, 5, 6, 7, 8].map((x) => ({ x, y: 100 + x }));

test('a shaded range spans its x values and says what it is in words', () => {
  const { container } = render(
    <LineChart
      series={[{ id: 'a', label: 'tempo', points }]}
      ranges={[{ from: 3, to: 5, label: 'rushing' }]}
      accessibilityLabel="test chart"
    />,
  );
  expect(screen.getByText('rushing')).toBeTruthy();
  // Where the path puts x = 3 and x = 5 (its 3rd and 5th vertices) is where the band starts and ends.
  const d = container.querySelector('path')!.getAttribute('d')!;
  const xs = [...d.matchAll(/[ML]\s*(-?[\d.]+)[ ,]/g)].map((m) => Number(m[1]));
  const rect = container.querySelector('rect')!;
  expect(Number(rect.getAttribute('x'))).toBeCloseTo(xs[2]!, 0);
  expect(Number(rect.getAttribute('x')) + Number(rect.getAttribute('width'))).toBeCloseTo(xs[4]!, 0);
  // A linear scale puts equal x steps at equal distances.
  for (let i = 2; i < xs.length; i++) expect(xs[i]! - xs[i - 1]!).toBeCloseTo(xs[1]! - xs[0]!, 0);
});

test('labels of reference lines one BPM apart are pushed apart so both stay readable', () => {
  render(
    <LineChart
      series={[{ id: 'a', label: 'tempo', points }]}
      referenceLines={[
        { y: 104, label: 'goal 104' },
        { y: 105, label: 'chosen 105' },
      ]}
      yDomain={[60, 180]}
      accessibilityLabel="test chart"
    />,
  );
  const y = (label: string) => Number(screen.getByText(label).getAttribute('y'));
  // 1 BPM of a 120 BPM span over ~180 px is under 2 px; the labels need a line of 12 px type between them.
  expect(Math.abs(y('goal 104') - y('chosen 105'))).toBeGreaterThanOrEqual(12);
  // The faster tempo's label stays the higher one.
  expect(y('chosen 105')).toBeLessThan(y('goal 104'));
});

test('labels of neighbouring shaded ranges never print over each other, and the bands keep their places', () => {
  // A take's end as the steadiness report draws it at phone width: rushing in bars 85–86, a rubato mark over
  // 87–91, rushing again in 92–100 — three bands a few pixels apart, each with its word.
  const bars = Array.from({ length: 100 }, (_, i) => ({ x: i + 1, y: 118 + i / 10 }));
  const { container } = render(
    <LineChart
      series={[{ id: 'a', label: 'tempo', points: bars }]}
      ranges={[
        { from: 85, to: 87, label: 'rushes' },
        { from: 87, to: 92, label: 'rubato' },
        { from: 92, to: 101, label: 'rushes' },
      ]}
      accessibilityLabel="test chart"
    />,
  );
  const labels = [...container.querySelectorAll('text')]
    .filter((t) => t.textContent === 'rushes' || t.textContent === 'rubato')
    .map((t) => ({ x: Number(t.getAttribute('x')), y: Number(t.getAttribute('y')), w: t.textContent!.length * 7.2 }));
  expect(labels).toHaveLength(3);
  for (let i = 0; i < labels.length; i++)
    for (let j = i + 1; j < labels.length; j++) {
      const [a, b] = [labels[i]!, labels[j]!];
      const apartSideways = Math.abs(a.x - b.x) >= (a.w + b.w) / 2;
      const apartUpDown = Math.abs(a.y - b.y) >= 12;
      expect(apartSideways || apartUpDown).toBe(true);
    }
  // Every label stays inside the drawing (320 px before layout), none cut off at the right edge.
  for (const l of labels) expect(l.x + l.w / 2).toBeLessThanOrEqual(320);
  // Every label sits above the plot, whose top is the bands' top.
  const top = Number(container.querySelector('rect')!.getAttribute('y'));
  for (const l of labels) expect(l.y).toBeLessThan(top);
  // The extra rows add to the drawing's height; the plot keeps the height it has with one row of labels.
  const oneRow = render(
    <LineChart
      series={[{ id: 'a', label: 'tempo', points: bars }]}
      ranges={[{ from: 85, to: 87, label: 'rushes' }]}
      accessibilityLabel="one band"
    />,
  ).container.querySelector('rect')!;
  expect(Number(container.querySelector('rect')!.getAttribute('height'))).toBeCloseTo(
    Number(oneRow.getAttribute('height')),
    5,
  );
});
