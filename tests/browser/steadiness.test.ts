// The steadiness report, rubato marks and the comparison of takes in the browser. Three click takes of one song,
// rendered from known tempo maps (a click on every beat, louder on each bar's first; truth by construction):
// one slows in bars 9–12 and comes back, one presses on by 4 % from bar 9, one holds 120 throughout. The player
// finds the slow bars in the report, loops them with one tap, marks them as a ritardando and sees the report
// leave them out; on the song screen two takes are laid over each other by bar, with the trend of the last takes.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { WaveFile } from 'wavefile';
import type { Browser, Page } from 'playwright-core';
import { launchChromium, outputDir, signInThroughApp, viewports } from './chromium';
import { baseUrl, PASSWORD, signedInUser, waitForAnalysis } from '@/tests/api/helpers';
import { clickTrack } from '@/tests/unit/signals';

let browser: Browser;
const RATE = 22050;
const INTERVALS = 84; // 21 bars of 4/4

/** A WAV of clicks whose k-th beat interval is played at bpmOf(k), from 0.5 s, accented every 4th beat. */
function takeFile(name: string, bpmOf: (k: number) => number, intervals = INTERVALS): string {
  const beats = [0.5];
  for (let k = 0; k < intervals; k++) beats.push(beats[beats.length - 1]! + 60 / bpmOf(k));
  const accents = new Set(beats.map((_, i) => i).filter((i) => i % 4 === 0));
  const samples = clickTrack(beats, beats[beats.length - 1]! + 1.5, RATE, accents);
  const wav = new WaveFile();
  wav.fromScratch(
    1,
    RATE,
    '16',
    Int16Array.from(samples, (x) => Math.round(Math.max(-1, Math.min(1, x)) * 32767)),
  );
  const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'tactus-steady-')), `${name}.wav`);
  fs.writeFileSync(file, wav.toBuffer());
  return file;
}

// Bars 9–12 (intervals 32–47) slow along half a cosine to 104 and come back (a depth the engine follows, see
// tests/unit/steadiness-engine.test.ts).
const ritardando = (k: number) => (k >= 32 && k < 48 ? 120 - 16 * Math.sin((Math.PI * (k - 32 + 0.5)) / 16) : 120);
// From bar 9 on, 4 % faster (124.8).
const rushing = (k: number) => (k < 32 ? 120 : 124.8);

let songId: string;
let ritId: string;
let referenceId: string;
let email: string;

beforeAll(async () => {
  browser = await launchChromium();
  const player = await signedInUser('steady-ui');
  email = player.email;
  songId = (await player.agent.post('/api/songs').send({ title: 'Lantern Street Shuffle', meter: '4/4' }).expect(201))
    .body.id;
  await player.agent.post(`/api/songs/${songId}/choose`).send({ bpm: 120 }).expect(200);
  const ids: string[] = [];
  for (const [name, map] of [
    ['monday-take', ritardando],
    ['wednesday-take', rushing],
    ['friday-take', () => 120],
  ] as const) {
    const id = (
      await player.agent
        .post(`/api/songs/${songId}/recordings`)
        .field('kind', 'take')
        .attach('file', takeFile(name, map), `${name}.wav`)
        .expect(201)
    ).body.id;
    expect((await waitForAnalysis(player.agent, id, 120_000)).status).toBe('done');
    ids.push(id);
  }
  ritId = ids[0]!;
  referenceId = (
    await player.agent
      .post(`/api/songs/${songId}/recordings`)
      .field('kind', 'reference')
      .attach(
        'file',
        takeFile('band-reference', () => 120),
        'band-reference.wav',
      )
      .expect(201)
  ).body.id;
  expect((await waitForAnalysis(player.agent, referenceId, 120_000)).status).toBe('done');
}, 400_000);
afterAll(async () => {
  await browser?.close();
});

const open = async (viewport: (typeof viewports)[number]) => {
  const context = await browser.newContext({ viewport: { width: viewport.width, height: viewport.height } });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await signInThroughApp(page, email, PASSWORD);
  return { context, page, errors };
};
/**
 * The card itself, in a window tall enough for the whole screen: the screen scrolls inside its own view, so a
 * full-page picture would stop at the fold, and sticky bars would cover a card scrolled under them.
 */
async function shot(page: Page, testId: string, name: string) {
  const size = page.viewportSize()!;
  await page.setViewportSize({ width: size.width, height: 6000 });
  await page.getByTestId(testId).screenshot({ path: path.join(outputDir, `${name}.png`) });
  await page.setViewportSize(size);
}
const summary = async (page: Page) => (await page.getByTestId('steadiness-summary').textContent()) ?? '';

test('the report finds the slow bars, loops them in one tap, and a ritardando mark takes them out', async () => {
  const { page, errors, context } = await open(viewports[1]);
  await page.goto(`${baseUrl}/recordings/${ritId}`);
  await page.getByTestId('play').filter({ hasText: 'Play' }).waitFor();
  await page.getByTestId('steadiness-summary').waitFor();
  // Bars 9–12 dip to 104 against the chosen 120: one slower region at the right bars (±1).
  expect(await summary(page)).toMatch(
    /^Starts at 120, ends at 120 — the same tempo; drags in bars (8|9|10)–(11|12|13)\.$/,
  );
  const region = page.locator('[data-testid^="loop-region-"]');
  expect(await region.count()).toBe(1);
  await shot(page, 'tempo-curve-card', 'steadiness-report-desktop');

  // One tap loops the bars it names.
  const named = /Drags in (bars \d+–\d+)/.exec((await page.getByTestId('steadiness-regions').textContent()) ?? '')!;
  await region.first().click();
  await page
    .getByTestId('loop-label')
    .filter({ hasText: `Looping ${named[1]}` })
    .waitFor();

  // Marked as a ritardando, the bars are left out: nothing strays, and the mark is listed with its bars.
  await page.getByTestId('mark-ritardando').click();
  await page
    .getByTestId('marked-ritardando')
    .filter({ hasText: /^ritardando · bars/ })
    .waitFor();
  await page.getByTestId('steadiness-summary').filter({ hasText: 'every bar within 3 % of 120' }).waitFor();
  expect(await region.count()).toBe(0);
  // The loop is marked now: it is not offered again.
  expect(await page.getByTestId('mark-rubato').count()).toBe(0);
  await shot(page, 'tempo-curve-card', 'steadiness-marked-desktop');

  // A narrower tolerance is the player's to set.
  await page.getByTestId('tolerance-2').click();
  await page.getByTestId('steadiness-summary').filter({ hasText: 'every bar within 2 % of 120' }).waitFor();
  expect(errors).toEqual([]);
  await context.close();
});

test('on a phone the report reads the same, with the mark kept', async () => {
  const { page, errors, context } = await open(viewports[0]);
  await page.goto(`${baseUrl}/recordings/${ritId}`);
  await page.getByTestId('play').filter({ hasText: 'Play' }).waitFor();
  await page.getByTestId('steadiness-summary').filter({ hasText: 'every bar within 3 % of 120' }).waitFor();
  await page
    .getByTestId('marked-ritardando')
    .filter({ hasText: /^ritardando · bars/ })
    .waitFor();
  await shot(page, 'tempo-curve-card', 'steadiness-report-phone');
  expect(errors).toEqual([]);
  await context.close();
});

test('a reference shows its tempo curve, and the steadiness report on request', async () => {
  const { page, errors, context } = await open(viewports[0]);
  await page.goto(`${baseUrl}/recordings/${referenceId}`);
  await page.getByTestId('play').filter({ hasText: 'Play' }).waitFor();
  await page.getByTestId('tempo-curve').waitFor();
  expect(await page.getByTestId('steadiness-summary').count()).toBe(0);
  await page.getByTestId('show-steadiness').click();
  await page.getByTestId('steadiness-summary').filter({ hasText: 'every bar within 3 % of 120' }).waitFor();
  expect(errors).toEqual([]);
  await context.close();
});

test('the song screen lays two takes over each other by bar and shows the trend of the last takes', async () => {
  for (const viewport of viewports) {
    const { page, errors, context } = await open(viewport);
    await page.goto(`${baseUrl}/songs/${songId}`);
    await page.getByTestId('take-comparison').waitFor();
    // The two newest takes to begin with: Friday's (steady) against Wednesday's (4 % faster from bar 9).
    const words = (await page.getByTestId('comparison-summary').textContent()) ?? '';
    expect(words).toMatch(
      /^Against wednesday-take\.wav, friday-take\.wav is 0:0\d longer and [\d.]+ BPM \([\d.]+ %\) slower on average\.$/,
    );
    expect(await page.locator('[data-testid="series-first"]').count()).toBe(1);
    expect(await page.locator('[data-testid="series-second"]').count()).toBe(1);
    await page.getByTestId('steadiness-trend').waitFor();
    expect(await page.getByTestId('trend').textContent()).toContain('The last 3 takes');
    // Another pick redraws the comparison.
    await page.getByTestId(`compare-first-${ritId}`).click();
    await page
      .getByTestId('comparison-summary')
      .filter({ hasText: /^Against monday-take\.wav/ })
      .waitFor();
    await page.getByTestId('take-comparison-card').scrollIntoViewIfNeeded();
    await shot(page, 'take-comparison-card', `steadiness-compare-${viewport.name}`);
    expect(errors).toEqual([]);
    await context.close();
  }
});

test('with eight takes the Compare card lists each recording once, one line apiece with its A and B', async () => {
  const player = await signedInUser('compare-many');
  const song = (await player.agent.post('/api/songs').send({ title: 'Mill Race Two-Step', meter: '4/4' }).expect(201))
    .body;
  // Eight short takes (eight bars each), a little faster each time: 112, 113, … 119 BPM.
  const ids: string[] = [];
  for (let n = 0; n < 8; n++) {
    const name = `take-${n + 1}`;
    const id = (
      await player.agent
        .post(`/api/songs/${song.id}/recordings`)
        .field('kind', 'take')
        .attach(
          'file',
          takeFile(name, () => 112 + n, 32),
          `${name}.wav`,
        )
        .expect(201)
    ).body.id;
    ids.push(id);
  }
  for (const id of ids) expect((await waitForAnalysis(player.agent, id, 120_000)).status).toBe('done');
  const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
  const page = await context.newPage();
  await signInThroughApp(page, player.email, PASSWORD);
  await page.goto(`${baseUrl}/songs/${song.id}`);
  await page.getByTestId('take-comparison').waitFor();
  const choices = page.getByTestId('compare-choices');
  expect(await choices.locator('[data-testid^="compare-first-"]').count()).toBe(8);
  expect(await choices.locator('[data-testid^="compare-second-"]').count()).toBe(8);
  // One line per take: eight rows of a 44 px touch target and their gaps, not two wrapped lists of names.
  const box = await choices.boundingBox();
  expect(box!.height).toBeLessThanOrEqual(8 * (44 + 8));
  // A on the first take and B on the last: the summary names them in that order.
  await page.getByTestId(`compare-first-${ids[0]}`).click();
  await page.getByTestId(`compare-second-${ids[7]}`).click();
  await page
    .getByTestId('comparison-summary')
    .filter({ hasText: /^Against take-1\.wav, take-8\.wav is/ })
    .waitFor();
  await page.getByTestId('take-comparison-card').scrollIntoViewIfNeeded();
  await page
    .getByTestId('take-comparison-card')
    .screenshot({ path: path.join(outputDir, 'compare-eight-takes-phone.png') });
  await context.close();
}, 240_000);
