// The analyze command as people and scripts use it: JSON fields, and exit code 2 for what is not audio.
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { AnalysisSchema } from '@/shared/analysis';

const root = path.resolve(__dirname, '../..');
const run = (...args: string[]) =>
  spawnSync(path.join(root, 'node_modules/.bin/tsx'), [path.join(root, 'server/cli/analyze.ts'), ...args], {
    encoding: 'utf8',
  });

test('--json prints one object with every field, for a committed clip', () => {
  const r = run(path.join(root, 'fixtures/clips/waltz-150.mp3'), '--json');
  expect(r.status).toBe(0);
  const lines = r.stdout.trim().split('\n');
  expect(lines).toHaveLength(1);
  const a = JSON.parse(lines[0]!);
  // Every field of the one definition of the analysis, and no other.
  expect(Object.keys(a).sort()).toEqual(Object.keys(AnalysisSchema.shape).sort());
  expect(Math.abs(a.bpm - 150)).toBeLessThan(1.5);
  expect(a.meter).toBe('3/4');
  expect(a.candidates[0]).toEqual({ bpm: expect.any(Number), score: expect.any(Number), relation: 'primary' });
  expect(a.curve[0]).toEqual({ t: expect.any(Number), bpm: expect.any(Number) });
});

test('a file that is not audio gets one line on stderr and exit code 2', () => {
  const r = run(path.join(root, 'assets/favicon.png'));
  expect(r.status).toBe(2);
  expect(r.stdout).toBe('');
  expect(r.stderr.trim().split('\n')).toHaveLength(1);
  expect(r.stderr).toContain('not a readable audio file');
});

test('a missing file also exits 2', () => {
  const r = run('/nonexistent/take.mp3');
  expect(r.status).toBe(2);
});

test('the human report names tempo, meter and drift', () => {
  const r = run(path.join(root, 'fixtures/clips/drums-bass-124.wav'));
  expect(r.status).toBe(0);
  expect(r.stdout).toMatch(/tempo\s+12[34](\.\d+)? BPM/);
  expect(r.stdout).toContain('meter      4/4');
});
