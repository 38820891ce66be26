// Recording a take against the click, in Chromium with a fake microphone fed from a generated file whose onsets
// are known by construction (fixtures/live-takes.ts): 20 beats on a 100 BPM grid (the first four fall in the
// count-in), then 8 beats each 30 ms earlier than the last. Chromium restarts the file each time the microphone
// is opened, so calibration and the run see the same file from its start; the fake device has no acoustic round
// trip, so the latency measured is the file's phase against the click, and the offsets are checked after it.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { outputDir, screenshotOf, signInThroughApp } from './chromium';
import { launchWithFakeMicrophone, refuseMicrophone, seenLiveMarks, watchLiveMarks } from './live-marks';
import { PASSWORD, signedInUser } from '@/tests/api/helpers';
import { hitTrainWav, steadyThenRushing } from '@/fixtures/live-takes';
import { OFFSET_TOLERANCE_MS } from '@/audio/live/feedback';

const BPM = 100;
const PER_BAR = 4;
const PERIOD = 60 / BPM;
const STEADY = 20;
const RUSHING = 8;
const RUSH_MS = 30;
/** Where the file's first hit sits: about where the first click falls after the microphone opens. */
const LEAD = 0.5;
const known = steadyThenRushing(BPM, STEADY, RUSHING, RUSH_MS, LEAD);
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tactus-fake-mic-'));
const MIC = path.join(dir, 'play-along.wav');
/**
 * The file opens with this much digital silence. Chromium's fake microphone drops a varying number of its 10 ms
 * buffers before the page's audio graph is attached; the card's count-in starts from the first sample that is
 * not silence, which is then the same place in the file whatever was dropped.
 */
const SILENT = 0.2;
// Two seconds after the last hit, so the run is stopped before Chromium loops the file.
fs.writeFileSync(MIC, hitTrainWav(known.times, 48000, LEAD + (STEADY + RUSHING) * PERIOD + 2, SILENT));

let browser: Browser;
beforeAll(async () => {
  browser = await launchWithFakeMicrophone(MIC);
});
afterAll(async () => {
  await browser?.close();
  fs.rmSync(dir, { recursive: true, force: true });
});

interface SeenMark {
  beat: number;
  offsetMs: number;
  state: string;
}

/** The file's beat number of a mark labelled "Bar b, beat k" (bar 1, beat 1 follows the one-bar count-in). */
const fileBeat = (bar: number, beat: number) => PER_BAR + (bar - 1) * PER_BAR + (beat - 1);

async function seenMarks(page: Page): Promise<SeenMark[]> {
  const labels = await seenLiveMarks(page);
  return labels.map((l) => {
    const m = /^Bar (\d+), beat (\d+): (\d+) ms (early|late), (\w+)$/.exec(l);
    if (!m) throw new Error(`unexpected mark label: ${l}`);
    return {
      beat: fileBeat(Number(m[1]), Number(m[2])),
      offsetMs: Number(m[3]) * (m[4] === 'early' ? -1 : 1),
      state: m[5]!,
    };
  });
}

test('calibrate, record against the click with live feedback, keep the take and see it analysed', async () => {
  const player = await signedInUser('record-ui');
  const song = (
    await player.agent
      .post('/api/songs')
      .send({ title: 'Lantern Hill Shuffle', meter: '4/4', workingBpm: BPM })
      .expect(201)
  ).body;
  const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
  await context.grantPermissions(['microphone']);
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await signInThroughApp(page, player.email, PASSWORD);
  await page.getByText('Lantern Hill Shuffle').click();
  await page.getByTestId('record-panel').waitFor();
  await page.getByText('Not measured on this browser yet', { exact: false }).waitFor();

  // Calibration: the clicks "come back" as the file's steady hits; a latency is measured and stored.
  await page.getByTestId('calibrate').click();
  await page.getByText('Latency measured:', { exact: false }).waitFor({ timeout: 20_000 });
  const stored = await page.evaluate(() => JSON.parse(localStorage.getItem('tactus.inputLatency') ?? 'null'));
  expect(Number.isFinite(stored.latencyMs)).toBe(true);
  expect(Math.abs(stored.latencyMs)).toBeLessThan(PERIOD * 500);

  // The run: watch every mark appear, stop once the last rushed beat is marked.
  await watchLiveMarks(page);
  await page.getByTestId('record-start').click();
  await page.getByTestId('live-view').waitFor();
  await page.getByTestId('input-level').waitFor();
  const lastBeat = STEADY + RUSHING - 1 - PER_BAR;
  const lastLabel = `Bar ${Math.floor(lastBeat / PER_BAR) + 1}, beat ${(lastBeat % PER_BAR) + 1}:`;
  await page.waitForFunction(
    (label) => (window as unknown as { seenMarks: string[] }).seenMarks.some((l) => l.startsWith(label)),
    lastLabel,
    { timeout: 40_000 },
  );
  await page.screenshot({ path: path.join(outputDir, 'record-live-phone.png'), fullPage: true });
  await page.setViewportSize({ width: 1280, height: 800 });
  await screenshotOf(page.getByTestId('live-view'), path.join(outputDir, 'record-live-desktop.png'));
  await page.setViewportSize({ width: 390, height: 844 });
  expect(await page.getByTestId('live-state').innerText()).toBe('Rushing');
  await page.getByTestId('record-stop').click();

  const marks = await seenMarks(page);
  // Every played beat after the count-in got a mark, on the file's own beat number.
  expect(marks.map((m) => m.beat)).toEqual(Array.from({ length: STEADY + RUSHING - PER_BAR }, (_, i) => i + PER_BAR));
  for (const m of marks) {
    // Offsets within ±10 ms of the file's (the requirement); the mark label rounds to whole ms.
    expect(Math.abs(m.offsetMs - known.offsetsMs[m.beat]!)).toBeLessThanOrEqual(10);
  }
  // Steady on the grid, and 'rushing' within one beat of the file starting to rush (beat STEADY).
  expect(marks.filter((m) => m.beat < STEADY).every((m) => m.state === 'steady')).toBe(true);
  const firstRushing = marks.find((m) => m.state === 'rushing')!.beat;
  expect(firstRushing).toBeGreaterThanOrEqual(STEADY);
  expect(firstRushing).toBeLessThanOrEqual(STEADY + 1);
  // The design tolerance is what makes the first rushed beat (30 ms early) read as rushing at once.
  expect(RUSH_MS).toBeGreaterThan(OFFSET_TOLERANCE_MS);
  const delays = await page.evaluate(() => (window as unknown as { tactusLive: { delaysMs: number[] } }).tactusLive);
  expect(delays.delaysMs.length).toBeGreaterThan(0);

  // Review: listen back, keep; the take is uploaded into the song and analysed like any take.
  await page.getByTestId('take-review').waitFor();
  await page.screenshot({ path: path.join(outputDir, 'record-review-phone.png'), fullPage: true });
  await page.getByTestId('listen-back').click();
  await page.getByText('Stop listening').waitFor();
  await page.getByTestId('take-label').fill('Shuffle against the click');
  await page.getByTestId('keep-take').click();
  await page.getByTestId('tempo-result').waitFor({ timeout: 60_000 });
  const recordings = (await player.agent.get(`/api/songs/${song.id}/recordings`).expect(200)).body.recordings;
  expect(recordings).toHaveLength(1);
  const take = recordings[0];
  expect(take).toMatchObject({ kind: 'take', label: 'Shuffle against the click' });
  const analysis = take.analysis;
  // The analysed tempo: 100 BPM where steady; the curve ends faster, as the file rushes to 60 / 0.57 s ≈ 105.3 BPM.
  expect(Math.abs(analysis.startBpm - BPM)).toBeLessThan(1.5);
  expect(analysis.endBpm).toBeGreaterThan(BPM * 1.03);
  const curve: { t: number; bpm: number }[] = analysis.curve;
  expect(Math.max(...curve.map((p) => p.bpm))).toBeGreaterThan(BPM * 1.03);
  expect(errors).toEqual([]);
  await context.close();
}, 150_000);

test('a discarded take is never sent: no new recording, the take list unchanged, the recorder ready again', async () => {
  const player = await signedInUser('record-discard');
  const song = (
    await player.agent
      .post('/api/songs')
      .send({ title: 'Birch Hollow Polka', meter: '4/4', workingBpm: BPM })
      .expect(201)
  ).body;
  // One take already there, so "unchanged" is a list of one, not an empty one.
  const earlier = hitTrainWav(known.times.slice(0, 12), 48000, LEAD + 12 * PERIOD + 1);
  await player.agent
    .post(`/api/songs/${song.id}/recordings`)
    .field('kind', 'take')
    .field('label', 'Last week')
    .attach('file', Buffer.from(earlier), 'last-week.wav')
    .expect(201);
  const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
  await context.grantPermissions(['microphone']);
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await signInThroughApp(page, player.email, PASSWORD);
  await page.getByText('Birch Hollow Polka').click();
  await page.getByTestId('record-panel').waitFor();
  await page.getByTestId('recording-row').first().waitFor();
  expect(await page.getByTestId('recording-row').count()).toBe(1);
  const posts: string[] = [];
  page.on('request', (r) => {
    if (r.method() === 'POST') posts.push(new URL(r.url()).pathname);
  });

  // A take of a few beats after the count-in, stopped, then discarded.
  await watchLiveMarks(page);
  await page.getByTestId('record-start').click();
  await page.waitForFunction(() => (window as unknown as { seenMarks: string[] }).seenMarks.length >= 3, null, {
    timeout: 30_000,
  });
  await page.getByTestId('record-stop').click();
  await page.getByTestId('take-review').waitFor();
  await page.getByTestId('discard-take').click();
  await page.getByText('The take was discarded; nothing was sent.').waitFor();

  expect(await page.getByTestId('take-review').count()).toBe(0);
  expect(await page.getByTestId('record-start').isEnabled()).toBe(true);
  expect(posts).toEqual([]);
  expect(await page.getByTestId('recording-row').count()).toBe(1);
  const recordings = (await player.agent.get(`/api/songs/${song.id}/recordings`).expect(200)).body.recordings;
  expect(recordings.map((r: { label: string }) => r.label)).toEqual(['Last week']);
  await page.screenshot({ path: path.join(outputDir, 'record-discarded-phone.png'), fullPage: true });
  expect(errors).toEqual([]);
  await context.close();
}, 90_000);

test('a refused microphone gets a plain message, and the rest of the song page still works', async () => {
  const player = await signedInUser('record-refused');
  await player.agent
    .post('/api/songs')
    .send({ title: 'Quiet Harbour Waltz', meter: '3/4', workingBpm: 90 })
    .expect(201);
  const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
  await refuseMicrophone(context);
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await signInThroughApp(page, player.email, PASSWORD);
  await page.getByText('Quiet Harbour Waltz').click();
  await page.getByTestId('record-start').click();
  await page.getByText('Tactus may not use the microphone', { exact: false }).waitFor();
  await page.screenshot({ path: path.join(outputDir, 'record-refused-phone.png'), fullPage: true });
  // The card is ready to try again, and the rest of the page still answers.
  expect(await page.getByTestId('record-start').isEnabled()).toBe(true);
  expect(await page.getByTestId('live-view').count()).toBe(0);
  await page.getByTestId('upload-panel').waitFor();
  await page.getByTestId('record-bpm').waitFor();
  await page.getByTestId('record-panel').getByRole('button', { name: '+1' }).click();
  await page.getByTestId('record-bpm').getByText('91 BPM').waitFor();
  await page.setViewportSize({ width: 1280, height: 900 });
  await screenshotOf(page.getByTestId('record-panel'), path.join(outputDir, 'record-refused-desktop.png'));
  expect(errors).toEqual([]);
  await context.close();
});
