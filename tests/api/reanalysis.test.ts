// One analysis contract: stored results are checked against shared/analysis.ts when read, each records the
// engine version that made it, and results of an older version are re-analysed in the background with the
// player's corrections kept.
import { execFile } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { promisify } from 'node:util';
import { query, signedInUser, waitForAnalysis } from './helpers';
import { root } from '@/tests/setup/processes';
import { ENGINE_VERSION } from '@/audio/analysis/version';

const clip = fs.readFileSync(path.join(root, 'fixtures/clips/waltz-150.mp3'));
const runScript = (script: string, ...args: string[]) =>
  promisify(execFile)(process.execPath, ['--import', 'tsx', path.join(root, script), ...args], {
    cwd: root,
    env: JSON.parse(process.env.TACTUS_TEST_SERVER_ENV!),
  });

let player: Awaited<ReturnType<typeof signedInUser>>;
let recordingId: string;

beforeAll(async () => {
  player = await signedInUser('reanalysis');
  const song = (await player.agent.post('/api/songs').send({ title: 'Lantern Waltz', meter: '3/4' }).expect(201)).body;
  const res = await player.agent
    .post(`/api/songs/${song.id}/recordings`)
    .field('kind', 'take')
    .attach('file', clip, 'lantern.mp3')
    .expect(201);
  recordingId = res.body.id;
  expect((await waitForAnalysis(player.agent, recordingId)).status).toBe('done');
});

test('each stored analysis records the engine version that made it', async () => {
  const [row] = await query<{ engineVersion: number }>(
    'tactus_test',
    'SELECT engineVersion FROM analyses WHERE recordingId = ?',
    [recordingId],
  );
  expect(row!.engineVersion).toBe(ENGINE_VERSION);
});

test('an analysis made by an older engine is re-analysed in the background and the corrections survive', async () => {
  // The player's corrections: a tempo, where the first beat falls, the level they feel, which beat is one, a nudge.
  const corrections = { correctedBpm: 75, beatOffsetSec: 0.12, beatLevel: 'half', barOneSec: 0.52, nudgeMs: -12 };
  await player.agent.patch(`/api/recordings/${recordingId}`).send(corrections).expect(200);
  // Pretend an older engine made the stored result, marked so that its replacement can be seen.
  const [stored] = await query<{ result: string }>('tactus_test', 'SELECT result FROM analyses WHERE recordingId = ?', [
    recordingId,
  ]);
  const old = { ...JSON.parse(stored!.result), confidence: 0.001, analysisMs: -1 };
  await query('tactus_test', 'UPDATE analyses SET engineVersion = ?, result = ? WHERE recordingId = ?', [
    ENGINE_VERSION - 1,
    JSON.stringify(old),
    recordingId,
  ]);

  const { stdout } = await runScript('server/scripts/reanalyze.ts');
  expect(stdout).toMatch(/[1-9]\d* recording\(s\) queued for re-analysis/);

  // While it runs the recording stays "done" with its current result: nobody waits for a re-analysis.
  const until = Date.now() + 30_000;
  let r;
  for (;;) {
    r = (await player.agent.get(`/api/recordings/${recordingId}`).expect(200)).body;
    expect(r.status).toBe('done');
    expect(r.analysis).not.toBeNull();
    if (r.analysis.analysisMs !== -1) break;
    if (Date.now() > until) throw new Error('the re-analysis did not finish within 30 s');
    await new Promise((res) => setTimeout(res, 200));
  }
  expect(r.analysis.confidence).toBeGreaterThan(0.001);
  expect(r.correctedBpm).toBe(75);
  expect(r.originalBpm).toBe(75);
  expect(r.beatOffsetSec).toBeCloseTo(0.12, 6);
  expect(r).toMatchObject({ beatLevel: 'half', barOneSec: 0.52, nudgeMs: -12 });
  const [row] = await query<{ engineVersion: number }>(
    'tactus_test',
    'SELECT engineVersion FROM analyses WHERE recordingId = ?',
    [recordingId],
  );
  expect(row!.engineVersion).toBe(ENGINE_VERSION);
});

test('a stored result that does not fit the analysis schema is shown as no analysis, not passed on', async () => {
  const [stored] = await query<{ result: string }>('tactus_test', 'SELECT result FROM analyses WHERE recordingId = ?', [
    recordingId,
  ]);
  await query('tactus_test', 'UPDATE analyses SET result = ? WHERE recordingId = ?', [
    JSON.stringify({ bpm: 'fast' }),
    recordingId,
  ]);
  try {
    const r = (await player.agent.get(`/api/recordings/${recordingId}`).expect(200)).body;
    expect(r.analysis).toBeNull();
    // The correction still gives the player a tempo to work with.
    expect(r.originalBpm).toBe(75);
  } finally {
    await query('tactus_test', 'UPDATE analyses SET result = ? WHERE recordingId = ?', [stored!.result, recordingId]);
  }
});

test('with every analysis current, the script queues nothing', async () => {
  // Only this file ever marks an analysis as older; by now it has been re-analysed.
  const { stdout } = await runScript('server/scripts/reanalyze.ts');
  expect(stdout).toMatch(/\b0 recording\(s\) queued/);
});
