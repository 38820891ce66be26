// Playing along with a reference at 80 % of its tempo, in Chromium with a fake microphone fed from a generated
// file whose onsets are known relative to the reference's beats by construction (fixtures/live-takes.ts).
// The reference is the drums-and-bass clip (fixtures/clips, 124 BPM by its tempo map); its analysed beats are the
// grid the player hears. Play-along starts the music a fixed margin (ALONG_MARGIN_SEC) after the microphone's
// first sound; Chromium restarts the fake file each time the microphone opens and the file opens with digital
// silence, so the file's first sound is that moment and each hit's place against the heard beats is known:
// beat j is heard ALONG_MARGIN_SEC + beats[j] / speed (+ the stretch method's heard offset) after it. Both sides
// are context times of the same AudioContext, so no latency is measured (none is stored in a fresh browser).
// Nothing is sent until the take is kept; kept, it is a take of the song, analysed like any upload.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Browser } from 'playwright-core';
import { launchChromium, outputDir, screenshotOf, signInThroughApp } from './chromium';
import { launchWithFakeMicrophone, refuseMicrophone, seenLiveMarks, watchLiveMarks } from './live-marks';
import { baseUrl, PASSWORD, signedInUser, waitForAnalysis } from '@/tests/api/helpers';
import { hitTrainWav } from '@/fixtures/live-takes';
import { ALONG_MARGIN_SEC } from '@/client/live-session';
import { DEFAULT_STRETCH_METHOD, heardOffsetFor } from '@/audio/playback/stretch-method';
import { barAt, beatInBar } from '@/audio/practice/passage';
import { tenth } from '@/shared/format';

const CLIP = fs.readFileSync(path.resolve(__dirname, '../../fixtures/clips/drums-bass-124.wav'));
const STEADY = 12;
const RUSHING = 6;
const RUSH_MS = 30;
/** Digital silence at the file's start (see record.test.ts: Chromium drops a varying number of first buffers). */
const SILENT = 0.2;
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tactus-fake-mic-'));
let browser: Browser | undefined;
/**
 * Chromium's fake capture device feeds its file in 10 ms buffers on a timer; on a loaded machine one run in about
 * eight here read a mark 11 ms off where the file says 1 ms — one such buffer, most likely dropped or delayed by
 * the device, which moves the file's later hits against the audio clock. The run is tried again, at most twice;
 * whichever run counts must pass every check below.
 */
jest.retryTimes(2, { logErrorsBeforeRetry: true });
afterAll(async () => {
  await browser?.close();
  fs.rmSync(dir, { recursive: true, force: true });
});

test('play along with a reference at 80 %: each beat marked against the reference within ±10 ms, rushing at once, the take kept', async () => {
  const player = await signedInUser('play-along');
  const song = (await player.agent.post('/api/songs').send({ title: 'Copper Kettle Reel', meter: '4/4' }).expect(201))
    .body;
  const uploaded = (
    await player.agent
      .post(`/api/songs/${song.id}/recordings`)
      .field('kind', 'reference')
      .attach('file', CLIP, 'kettle.wav')
      .expect(201)
  ).body;
  const rec = await waitForAnalysis(player.agent, uploaded.id);
  expect(rec.status).toBe('done');
  const beats: number[] = rec.analysis.beats;
  const downbeats: number[] = rec.analysis.downbeats;
  expect(beats.length).toBeGreaterThanOrEqual(STEADY + RUSHING);

  // 80 % of the reference's tempo, to a tenth as the player sets it.
  const bpm = tenth(rec.originalBpm * 0.8);
  const speed = bpm / rec.originalBpm;
  const heard = heardOffsetFor(DEFAULT_STRETCH_METHOD, speed);
  // The player's hits: on the heard beats, then each RUSH_MS earlier than the last.
  const offsetsMs = Array.from({ length: STEADY + RUSHING }, (_, j) => (j < STEADY ? 0 : -(j - STEADY + 1) * RUSH_MS));
  const hits = offsetsMs.map((off, j) => SILENT + ALONG_MARGIN_SEC + beats[j]! / speed + heard + off / 1000);
  const mic = path.join(dir, 'along.wav');
  // Two seconds past the last hit: the run is stopped before Chromium loops the file.
  fs.writeFileSync(mic, hitTrainWav(hits, 48000, hits[hits.length - 1]! + 2, SILENT));
  await browser?.close(); // a retried run starts with a fresh device
  browser = await launchWithFakeMicrophone(mic);

  const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
  await context.grantPermissions(['microphone']);
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  const uploads: string[] = [];
  page.on('request', (r) => {
    if (r.method() === 'POST') uploads.push(r.url());
  });
  await signInThroughApp(page, player.email, PASSWORD);
  await page.goto(`${baseUrl}/recordings/${rec.id}`);
  await page.getByTestId('play').filter({ hasText: 'Play' }).waitFor();
  await page.getByTestId('exact-bpm').fill(String(bpm));
  await page.getByTestId('set-bpm').click();
  await page.getByTestId('playback-percent').filter({ hasText: '80 %' }).waitFor();
  await page.getByTestId('play-along').getByText('nothing leaves this browser', { exact: false }).waitFor();

  await watchLiveMarks(page);
  await page.getByTestId('play-along-start').click();
  await page.getByTestId('live-view').waitFor();
  // The stretch method whose heard offset the file was made for.
  const method = await page.evaluate(
    () => (window as unknown as { tactusAudition: { stats: { stretchMethod: string } } }).tactusAudition.stats,
  );
  expect(method.stretchMethod).toBe(DEFAULT_STRETCH_METHOD);
  await page.waitForFunction((n) => (window as unknown as { seenMarks: string[] }).seenMarks.length >= n, STEADY + 2, {
    timeout: 40_000,
  });
  await page.getByTestId('play-along').evaluate((e) => e.scrollIntoView({ block: 'start' }));
  await page.screenshot({ path: path.join(outputDir, 'play-along-phone.png'), fullPage: false });
  await page.getByTestId('play-along').screenshot({ path: path.join(outputDir, 'play-along-card-phone.png') });
  await page.waitForFunction(
    (n) => (window as unknown as { seenMarks: string[] }).seenMarks.length >= n,
    STEADY + RUSHING,
    {
      timeout: 40_000,
    },
  );
  expect(await page.getByTestId('live-state').innerText()).toBe('Rushing');
  // The target is the reference's own tempo at 80 % over the same beats (the clip is steady: the BPM set).
  const line = await page.getByTestId('live-bpm').innerText();
  const target = Number(/target ([\d.]+) BPM/.exec(line)?.[1]);
  expect(Math.abs(target - bpm)).toBeLessThan(1.5);
  await page.setViewportSize({ width: 1280, height: 800 });
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.getByTestId('play-along').evaluate((e) => e.scrollIntoView({ block: 'nearest' }));
  await page.screenshot({ path: path.join(outputDir, 'play-along-desktop.png') });
  await page.getByTestId('play-along-stop').click();
  await page.getByTestId('play-along').getByTestId('take-review').waitFor();
  await page.setViewportSize({ width: 390, height: 844 });
  // The phone layout moves the card under the player: it is re-mounted.
  await screenshotOf(page.getByTestId('play-along'), path.join(outputDir, 'play-along-review-phone.png'));
  await page.getByTestId('play').filter({ hasText: 'Play' }).waitFor();

  const labels = (await seenLiveMarks(page)).slice(0, STEADY + RUSHING);
  const marks = labels.map((l) => {
    const m = /^Bar (\d+), beat (\d+): (\d+) ms (early|late), (\w+)$/.exec(l);
    if (!m) throw new Error(`unexpected mark label: ${l}`);
    return {
      bar: Number(m[1]),
      beat: Number(m[2]),
      offsetMs: Number(m[3]) * (m[4] === 'early' ? -1 : 1),
      state: m[5]!,
    };
  });
  marks.forEach((m, j) => {
    // Each beat played is marked on its own beat of the reference, counted as the reference's bars.
    expect({ bar: m.bar, beat: m.beat }).toEqual({
      bar: barAt(beats[j]!, downbeats),
      beat: beatInBar(beats[j]!, beats, downbeats),
    });
    // Within ±10 ms of the file's known offset (the requirement); the label rounds to whole ms.
    expect(Math.abs(m.offsetMs - offsetsMs[j]!)).toBeLessThanOrEqual(10);
  });
  expect(marks.slice(0, STEADY).every((m) => m.state === 'steady')).toBe(true);
  // The first rushed beat is 30 ms early, beyond the 25 ms tolerance: rushing on that very beat.
  expect(marks[STEADY]!.state).toBe('rushing');
  // Nothing was sent while playing along, nor at stop: the take waits in the browser.
  expect(uploads.filter((u) => u.includes('/recordings'))).toEqual([]);

  // Kept: a take of the song, uploaded and analysed like any other; it plays at the tempo played along with.
  await page.getByTestId('keep-take').click();
  await page.getByText('The take was kept', { exact: false }).waitFor({ timeout: 30_000 });
  expect(uploads.filter((u) => u.includes('/recordings'))).toHaveLength(1);
  const all = (await player.agent.get(`/api/songs/${song.id}/recordings`).expect(200)).body.recordings;
  const kept = all.find((r: { kind: string }) => r.kind === 'take');
  expect(kept).toMatchObject({ label: `Played along at ${bpm} BPM` });
  const analysed = await waitForAnalysis(player.agent, kept.id, 60_000);
  expect(analysed.status).toBe('done');
  // Steady on the reference's beats at 80 % for its first twelve beats (the clip is steady: the BPM set).
  expect(Math.abs(analysed.analysis.startBpm - bpm)).toBeLessThan(2);
  expect(errors).toEqual([]);
  await context.close();
}, 180_000);

test('play-along with the microphone refused: a plain message, and the player still plays', async () => {
  browser ??= await launchChromium();
  const player = await signedInUser('play-along-refused');
  const song = (await player.agent.post('/api/songs').send({ title: 'Slate Roof Jig', meter: '4/4' }).expect(201)).body;
  const uploaded = (
    await player.agent
      .post(`/api/songs/${song.id}/recordings`)
      .field('kind', 'reference')
      .attach('file', CLIP, 'slate.wav')
      .expect(201)
  ).body;
  expect((await waitForAnalysis(player.agent, uploaded.id)).status).toBe('done');
  const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
  await refuseMicrophone(context);
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await signInThroughApp(page, player.email, PASSWORD);
  await page.goto(`${baseUrl}/recordings/${uploaded.id}`);
  await page.getByTestId('play').filter({ hasText: 'Play' }).waitFor();
  await page.getByTestId('play-along-start').click();
  await page.getByTestId('play-along').getByText('Tactus may not use the microphone', { exact: false }).waitFor();
  await page.getByTestId('play-along').screenshot({ path: path.join(outputDir, 'play-along-refused-phone.png') });
  expect(await page.getByTestId('live-view').count()).toBe(0);
  // The player still works: it plays, and pauses.
  await page.getByTestId('play').filter({ hasText: 'Play' }).click();
  await page.getByTestId('play').filter({ hasText: 'Pause' }).waitFor();
  await page.getByTestId('play').click();
  await page.getByTestId('play').filter({ hasText: 'Play' }).waitFor();
  expect(await page.getByTestId('play-along-start').isEnabled()).toBe(true);
  expect(errors).toEqual([]);
  await context.close();
});
