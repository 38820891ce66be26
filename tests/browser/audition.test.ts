// The first steps of the audition player in a real browser: the tempo control in BPM with the share of the
// original, and playback that moves through the recording.
import fs from 'node:fs';
import path from 'node:path';
import type { Browser } from 'playwright-core';
import { launchChromium, outputDir, signInThroughApp } from './chromium';
import { baseUrl, PASSWORD, signedInUser, waitForAnalysis } from '../api/helpers';

const CLIP = fs.readFileSync(path.resolve(__dirname, '../../fixtures/clips/drums-bass-124.wav'));
let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

test('set 75 %, then an exact BPM, play and see the position move', async () => {
  const player = await signedInUser('audition');
  const song = (await player.agent.post('/api/songs').send({ title: 'Drift Ice Hornpipe' }).expect(201)).body;
  const rec = (await player.agent.post(`/api/songs/${song.id}/recordings`).field('kind', 'reference').attach('file', CLIP, 'groove.wav').expect(201)).body;
  expect((await waitForAnalysis(player.agent, rec.id)).status).toBe('done');

  const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await signInThroughApp(page, player.email, PASSWORD);
  await page.goto(`${baseUrl}/recordings/${rec.id}`);
  await page.getByTestId('audition').waitFor();

  await page.getByRole('button', { name: '75 %' }).click();
  // 124 BPM (the clip's tempo map) × 0.75 = 93.
  await page.getByTestId('playback-bpm').filter({ hasText: /^93(\.0)? BPM$/ }).waitFor();
  await page.getByTestId('playback-percent').filter({ hasText: '75 %' }).waitFor();
  await page.getByTestId('exact-bpm').fill('100');
  await page.getByTestId('set-bpm').click();
  await page.getByTestId('playback-bpm').filter({ hasText: /^100 BPM$/ }).waitFor();
  await page.getByTestId('playback-percent').filter({ hasText: '81 %' }).waitFor();
  await page.getByRole('button', { name: 'mark ▸' }).click();
  await page.getByTestId('playback-bpm').filter({ hasText: /^104 BPM$/ }).waitFor();

  await page.getByTestId('play').click();
  await page.waitForFunction(() => Number(document.querySelector('[data-testid="playback-position"]')?.textContent ?? 0) > 1, undefined, { timeout: 15_000 });
  await page.screenshot({ path: path.join(outputDir, 'audition-phone.png'), fullPage: true });
  await page.getByTestId('play').click();
  expect(errors).toEqual([]);
  await context.close();
});
