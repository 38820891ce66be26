// The audition player in a real browser, on a generated fixture whose tempo is known by construction (the
// drums-and-bass clip's tempo map says 124 BPM, 4/4): tempo by share and by exact BPM, playback, hopping between
// three candidates without losing the place, marking the chosen tempo and finding it again after a reload, a
// step-up loop that writes a practice entry, keyboard shortcuts and WAV export.
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { launchChromium, outputDir, signInThroughApp } from './chromium';
import { baseUrl, PASSWORD, signedInUser, waitForAnalysis } from '@/tests/api/helpers';

const CLIP = fs.readFileSync(path.resolve(__dirname, '../../fixtures/clips/drums-bass-124.wav'));
const CLIP_SECONDS = 12;
let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

async function songWithClip(label: string, title: string) {
  const player = await signedInUser(label);
  const song = (
    await player.agent.post('/api/songs').send({ title, meter: '4/4', goalBpm: 124, workingBpm: 96 }).expect(201)
  ).body;
  const rec = (
    await player.agent
      .post(`/api/songs/${song.id}/recordings`)
      .field('kind', 'reference')
      .attach('file', CLIP, 'groove.wav')
      .expect(201)
  ).body;
  expect((await waitForAnalysis(player.agent, rec.id)).status).toBe('done');
  return { player, song, rec };
}

/** Seconds shown by the position readout ("m:ss.s"). */
async function position(page: Page): Promise<number> {
  const text = (await page.getByTestId('playback-position').textContent()) ?? '';
  const m = /^(\d+):(\d+(?:\.\d+)?)$/.exec(text.trim());
  if (!m) throw new Error(`unexpected position readout "${text}"`);
  return Number(m[1]) * 60 + Number(m[2]);
}

const bpmShown = (page: Page, bpm: number) =>
  page
    .getByTestId('playback-bpm')
    .filter({ hasText: new RegExp(`^${bpm}(\\.0)? BPM$`) })
    .waitFor();

async function setExact(page: Page, bpm: number) {
  await page.getByTestId('exact-bpm').fill(String(bpm));
  await page.getByTestId('set-bpm').click();
  await bpmShown(page, bpm);
}

test('75 %, an exact BPM, three candidates hopped while playing, the chosen tempo kept after a reload, a step-up loop logged', async () => {
  const { player, song, rec } = await songWithClip('audition', 'Drift Ice Hornpipe');
  const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await signInThroughApp(page, player.email, PASSWORD);
  await page.goto(`${baseUrl}/recordings/${rec.id}`);
  await page.getByTestId('audition').waitFor();
  // The audio is loaded (the play button says so) before the first tap.
  await page.getByTestId('play').filter({ hasText: 'Play' }).waitFor();

  await page.getByRole('button', { name: '75 %' }).click();
  // 124 BPM (the clip's tempo map) × 0.75 = 93.
  await bpmShown(page, 93);
  await page.getByTestId('playback-percent').filter({ hasText: '75 %' }).waitFor();
  await setExact(page, 100);
  await page.getByTestId('playback-percent').filter({ hasText: '81 %' }).waitFor();
  await page.getByRole('button', { name: 'Next metronome mark' }).click();
  // The next mark of the mechanical metronome scale above 100 is 104 (common practice).
  await bpmShown(page, 104);

  // Three candidates, added while the music plays.
  await page.getByTestId('play').filter({ hasText: 'Play' }).waitFor();
  await page.getByTestId('play').click();
  await page.waitForFunction(() => document.querySelector('[data-testid="play"]')?.textContent === 'Pause');
  for (const bpm of [100, 110, 120]) {
    await setExact(page, bpm);
    await page.getByTestId('add-candidate').click();
    await page.getByTestId(`candidate-${bpm}`).waitFor();
  }
  const candidates = (await player.agent.get(`/api/songs/${song.id}/candidates`).expect(200)).body.candidates;
  expect(candidates.map((c: { bpm: number }) => c.bpm)).toEqual([100, 110, 120]);

  // Hopping keeps the place: the position goes on from where it was rather than starting over.
  await page.waitForFunction(
    () => /^0:0[1-9]/.test(document.querySelector('[data-testid="playback-position"]')?.textContent ?? ''),
    undefined,
    { timeout: 15_000 },
  );
  let last = await position(page);
  for (const [hop, bpm] of [
    [1, 100],
    [3, 120],
    [2, 110],
  ] as const) {
    await page.getByTestId(`hop-${hop}`).click();
    await bpmShown(page, bpm);
    await page.waitForTimeout(300);
    const now = await position(page);
    expect(now).toBeGreaterThan(last);
    last = now;
  }
  // The stretch runs on the audio thread, in the AudioWorklet.
  expect(
    await page.evaluate(
      () => (window as unknown as { tactusAudition: { stats: { engine: string } } }).tactusAudition.stats.engine,
    ),
  ).toBe('audio-worklet');
  await page.screenshot({ path: path.join(outputDir, 'audition-phone.png') });

  // Rate 110, write a line on it, and mark it as the chosen tempo with a note.
  await page.getByRole('button', { name: 'Rate 110 BPM 4 of 5' }).click();
  await page.getByTestId('candidate-note-110').fill('the rolls sit cleanly here');
  await page.getByTestId('candidate-note-110').press('Enter');
  await page.getByTestId('choose-110').click();
  await page.getByTestId('chosen-note').fill('Danceable without rushing the turns.');
  await page.getByTestId('confirm-choice').click();
  await page.getByTestId('candidate-110').getByText('Chosen tempo').waitFor();

  await page.reload();
  await page.getByTestId('candidate-110').getByText('Chosen tempo').waitFor();
  await page.getByTestId('candidate-110').getByText('“Danceable without rushing the turns.”').waitFor();
  expect(await page.getByTestId('candidate-note-110').inputValue()).toBe('the rolls sit cleanly here');
  expect(await page.getByTestId('candidate-110').getByText('★').count()).toBe(4);
  await page.getByTestId('candidate-110').getByText('4 of 5').waitFor();
  const saved = (await player.agent.get(`/api/songs/${song.id}`).expect(200)).body;
  expect(saved).toMatchObject({ chosenBpm: 110, chosenNote: 'Danceable without rushing the turns.' });

  // Step-up over bar 2: 100 → 105 → 110 BPM, one clean pass per step: two steps up, three passes.
  // Bar 1 may start right at 0:00 or after a short lead-in, so step on until the readout says bar 2.
  for (let i = 0; i < 3 && (await page.getByTestId('playback-bar').textContent()) !== '2'; i++) {
    await page.getByTestId('bar-forward').click();
    await page.waitForTimeout(150);
  }
  await page.getByTestId('playback-bar').filter({ hasText: /^2$/ }).waitFor();
  await page.getByTestId('loop-this-bar').click();
  await page.getByTestId('loop-label').filter({ hasText: 'Looping bar 2' }).waitFor();
  await page.getByTestId('stepup-startBpm').fill('100');
  await page.getByTestId('stepup-stepBpm').fill('5');
  await page.getByTestId('stepup-repsPerStep').fill('1');
  await page.getByTestId('stepup-goalBpm').fill('110');
  await page.getByTestId('start-stepup').click();
  await bpmShown(page, 100);
  await bpmShown(page, 105);
  await page.getByTestId('stepup-status').getByText('Goal reached: 110 BPM').waitFor({ timeout: 20_000 });
  await page.getByText(/^Logged: bar 2, 100 → 110 BPM, 3 repetitions/).waitFor();
  await page.screenshot({ path: path.join(outputDir, 'audition-stepup-phone.png') });
  const log = (await player.agent.get(`/api/songs/${song.id}/practice`).expect(200)).body.entries;
  expect(log).toHaveLength(1);
  expect(log[0]).toMatchObject({ passage: 'bar 2', startBpm: 100, reachedBpm: 110, repetitions: 3, clean: true });
  // Clean at 110 above the working tempo of 96: the raise is offered, taken, and undone.
  const offer = page.getByTestId('raise-offer');
  await offer.getByText('That was clean at 110 BPM. Now 96 BPM.').waitFor();
  await offer.getByTestId('accept-raise').click();
  await offer.getByText('Raised the working tempo to 110 BPM.').waitFor();
  expect((await player.agent.get(`/api/songs/${song.id}`).expect(200)).body.workingBpm).toBe(110);
  await offer.getByTestId('undo-raise').click();
  await offer.getByText('The working tempo is back at 96 BPM.').waitFor();
  expect((await player.agent.get(`/api/songs/${song.id}`).expect(200)).body.workingBpm).toBe(96);

  expect(errors).toEqual([]);
  await context.close();
});

test('on a wide screen: space, arrows and number keys; the recording and the loop download as WAV at the chosen tempo', async () => {
  const { player, song, rec } = await songWithClip('audition-keys', 'Saltmarsh Strathspey');
  for (const bpm of [93, 124]) await player.agent.post(`/api/songs/${song.id}/candidates`).send({ bpm }).expect(201);
  const context = await browser.newContext({ viewport: { width: 1280, height: 900 }, acceptDownloads: true });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await signInThroughApp(page, player.email, PASSWORD);
  await page.goto(`${baseUrl}/recordings/${rec.id}`);
  await page.getByTestId('play').filter({ hasText: 'Play' }).waitFor();
  await page.waitForFunction(
    () => document.querySelector('[data-testid="play"]')?.getAttribute('aria-disabled') !== 'true',
  );

  await page.keyboard.press('1');
  await bpmShown(page, 93);
  await page.keyboard.press('ArrowUp');
  await bpmShown(page, 94);
  await page.keyboard.press('ArrowDown');
  await page.keyboard.press('ArrowDown');
  await bpmShown(page, 92);
  await page.keyboard.press('2');
  await bpmShown(page, 124);
  await page.keyboard.press('ArrowRight');
  await page
    .getByTestId('playback-bar')
    .filter({ hasText: /^[12]$/ })
    .waitFor();
  expect(await position(page)).toBeGreaterThan(0);
  // With the count-in on, one bar of clicks comes first (4 beats at 124 BPM = 1.94 s): the place holds still.
  await page.getByTestId('count-in').click();
  const before = await position(page);
  await page.keyboard.press(' ');
  await page.getByTestId('play').filter({ hasText: 'Pause' }).waitFor();
  await page.waitForTimeout(1000);
  expect(await position(page)).toBeCloseTo(before, 1);
  await page.waitForFunction(
    (b) => {
      const m = /^(\d+):(\d+\.\d)$/.exec(
        document.querySelector('[data-testid="playback-position"]')?.textContent ?? '',
      );
      return !!m && Number(m[1]) * 60 + Number(m[2]) > b + 0.3;
    },
    before,
    { timeout: 5000 },
  );
  await page.keyboard.press(' ');
  await page.getByTestId('play').filter({ hasText: 'Play' }).waitFor();
  await page.screenshot({ path: path.join(outputDir, 'audition-desktop.png'), fullPage: true });

  // Tapping the middle of the waveform moves the playhead to the middle of the recording.
  const wave = (await page.getByTestId('player-waveform').boundingBox())!;
  await page.mouse.click(wave.x + wave.width / 2, wave.y + wave.height / 2);
  await page.waitForTimeout(200);
  expect(Math.abs((await position(page)) - CLIP_SECONDS / 2)).toBeLessThan(0.3);

  // Export at 93 BPM = 0.75 × 124: the file lasts 12 s / 0.75 = 16 s. Read back by ffprobe (FFmpeg), not by us.
  await page.keyboard.press('1');
  await bpmShown(page, 93);
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tactus-export-'));
  const probe = (file: string) =>
    JSON.parse(
      execFileSync('ffprobe', ['-v', 'error', '-show_streams', '-show_format', '-of', 'json', file]).toString(),
    );
  const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('export-recording').click()]);
  expect(download.suggestedFilename()).toBe('Saltmarsh Strathspey - 93 BPM.wav');
  const whole = path.join(dir, 'whole.wav');
  await download.saveAs(whole);
  const info = probe(whole);
  expect(info.streams[0]).toMatchObject({ codec_name: 'pcm_s16le', channels: 2 });
  expect(Number(info.format.duration)).toBeCloseTo(CLIP_SECONDS / 0.75, 1);

  // A loop of one bar, 4 beats at 124 BPM, is 4 × 60 / 93 s long at 93 BPM.
  await page.getByTestId('loop-this-bar').click();
  const label = /Looping (bar \d+)/.exec((await page.getByTestId('loop-label').textContent()) ?? '')?.[1];
  expect(label).toBeDefined();
  const [loopDownload] = await Promise.all([page.waitForEvent('download'), page.getByTestId('export-loop').click()]);
  expect(loopDownload.suggestedFilename()).toBe(`Saltmarsh Strathspey - ${label} - 93 BPM.wav`);
  const loopFile = path.join(dir, 'loop.wav');
  await loopDownload.saveAs(loopFile);
  expect(Number(probe(loopFile).format.duration)).toBeCloseTo((4 * 60) / 93, 1);
  fs.rmSync(dir, { recursive: true, force: true });
  expect(errors).toEqual([]);
  await context.close();
});

test('without an AudioWorklet (an insecure origin) the same engine runs in a ScriptProcessor', async () => {
  const { player, rec } = await songWithClip('audition-fallback', 'Tidewater Jig');
  const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
  await context.addInitScript(() => {
    delete (window as unknown as { AudioWorkletNode?: unknown }).AudioWorkletNode;
  });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await signInThroughApp(page, player.email, PASSWORD);
  await page.goto(`${baseUrl}/recordings/${rec.id}`);
  await page.waitForFunction(
    () => document.querySelector('[data-testid="play"]')?.getAttribute('aria-disabled') !== 'true',
  );
  await page.getByTestId('play').click();
  await page.waitForFunction(
    () => /^0:0[1-9]/.test(document.querySelector('[data-testid="playback-position"]')?.textContent ?? ''),
    undefined,
    { timeout: 15_000 },
  );
  await page.getByRole('button', { name: '+1' }).click();
  await bpmShown(page, 125);
  await page.waitForTimeout(300);
  const stats = await page.evaluate(
    () =>
      (window as unknown as { tactusAudition: { stats: { engine: string; changeLatencies: number[] } } }).tactusAudition
        .stats,
  );
  expect(stats.engine).toBe('script-processor');
  // The change is applied at a block boundary a few 1024-frame blocks (23 ms each at 44.1 kHz) on: one block when
  // the machine is idle, more when it is loaded, since a ScriptProcessor runs on the page's main thread. The
  // figure itself is a benchmark's (npm run bench:player); here it must stay within ten blocks.
  expect(stats.changeLatencies).toHaveLength(1);
  expect(stats.changeLatencies[0]!).toBeLessThan(0.25);
  expect(errors).toEqual([]);
  await context.close();
});

test('click-only mode: the plain metronome in 3/4 at a chosen tempo', async () => {
  const player = await signedInUser('metronome');
  const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await signInThroughApp(page, player.email, PASSWORD);
  await page.goto(`${baseUrl}/practice`);
  await page.getByTestId('metronome').waitFor();
  await page.getByTestId('metronome').getByRole('button', { name: '3/4' }).click();
  await page.getByTestId('metronome').getByRole('button', { name: 'Next metronome mark' }).click();
  // From 100 the next mark is 104 (common practice: the mechanical metronome's scale).
  await page
    .getByTestId('metronome-bpm')
    .filter({ hasText: /^104 BPM$/ })
    .waitFor();
  await page.getByTestId('metronome-start').click();
  // A light follows the beat: three lights in 3/4.
  await page.getByTestId('beat-lit').waitFor();
  await page.waitForTimeout(2000);
  const clicks = await page.evaluate(
    () => (window as unknown as { tactusMetronome: { clicks: number } }).tactusMetronome.clicks,
  );
  // 2 s at 104 BPM is 3.5 beats, plus up to 0.12 s scheduled ahead.
  expect(clicks).toBeGreaterThanOrEqual(3);
  expect(clicks).toBeLessThanOrEqual(5);
  await page.screenshot({ path: path.join(outputDir, 'metronome-phone.png'), fullPage: true });
  await page.getByTestId('metronome-start').click();
  expect(errors).toEqual([]);
  await context.close();
});

test('the slowed-down sound chosen in Account is the one the player uses: the phase vocoder unless "Crisp hits"', async () => {
  const { player, rec } = await songWithClip('audition-stretch', 'Lantern Slip Jig');
  const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await signInThroughApp(page, player.email, PASSWORD);
  const methodInUse = async () => {
    await page.goto(`${baseUrl}/recordings/${rec.id}`);
    // Play is offered once the engine has built its stretcher and said which.
    await page
      .getByTestId('play')
      .filter({ hasText: /^Play$/ })
      .waitFor();
    await page.waitForFunction(() => {
      const play = document.querySelector('[data-testid="play"]');
      return play !== null && play.getAttribute('aria-disabled') !== 'true';
    });
    return page.evaluate(
      () =>
        (window as unknown as { tactusAudition: { stats: { stretchMethod: string } } }).tactusAudition.stats
          .stretchMethod,
    );
  };
  expect(await methodInUse()).toBe('phase-vocoder');

  await page.goto(`${baseUrl}/account`);
  await page.getByTestId('playback-settings').waitFor();
  await page.screenshot({ path: path.join(outputDir, 'account-phone-stretch.png'), fullPage: true });
  await page.getByTestId('stretch-overlap-add').click();
  await page
    .getByTestId('stretch-says')
    .getByText(/Sharper drum hits/)
    .waitFor();
  expect((await player.agent.get('/api/me/preferences').expect(200)).body.stretchMethod).toBe('overlap-add');
  await page.setViewportSize({ width: 1280, height: 800 });
  await page.screenshot({ path: path.join(outputDir, 'account-desktop-stretch.png'), fullPage: true });
  await page.setViewportSize({ width: 390, height: 844 });

  expect(await methodInUse()).toBe('overlap-add');
  await page.getByTestId('play').click();
  await page.waitForFunction(
    () => /^0:0[1-9]/.test(document.querySelector('[data-testid="playback-position"]')?.textContent ?? ''),
    undefined,
    { timeout: 15_000 },
  );
  await page.getByTestId('play').click();
  expect(errors).toEqual([]);
  await context.close();
});
