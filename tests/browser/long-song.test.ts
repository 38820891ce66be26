// The player on a long recording, generated here (never committed): a 4-minute click track at 120 BPM in 4/4 with
// accented downbeats, so every bar's place is known by construction (bar n starts at 0.5 s + (n − 1) × 2 s).
// At 390 px: zoom to bar 57, drag bars 57–60, name the passage, reload and find it, loop it, step up twice, see
// the practice entry tied to the passage and take the offered raise; scroll to the candidates and press play in the compact transport; halve
// the beat (every other beat, bar numbers recounted, the click's grid with it); "this beat is one" moves bar 1.
// At 1280 px: the waveform stays in view while the side column scrolls. Screenshots of both widths zoomed out and
// in go to test-output/.
import path from 'node:path';
import { WaveFile } from 'wavefile';
import type { Browser, Page } from 'playwright-core';
import { launchChromium, outputDir, signInThroughApp } from './chromium';
import { baseUrl, PASSWORD, signedInUser, waitForAnalysis } from '@/tests/api/helpers';
import { clickTrack, RATE, steadyBeats } from '@/tests/unit/signals';

const SECONDS = 240;
const BPM = 120;
let browser: Browser;
let wav: Buffer;
beforeAll(async () => {
  browser = await launchChromium();
  const beats = steadyBeats(BPM, SECONDS);
  const accents = new Set(beats.map((_, i) => i).filter((i) => i % 4 === 0));
  const x = clickTrack(beats, SECONDS, RATE, accents);
  const w = new WaveFile();
  w.fromScratch(
    1,
    RATE,
    '16',
    Int16Array.from(x, (v) => Math.round(Math.max(-1, Math.min(1, v)) * 32767)),
  );
  wav = Buffer.from(w.toBuffer());
});
afterAll(async () => {
  await browser?.close();
});

async function longSong(label: string) {
  const player = await signedInUser(label);
  const song = (
    await player.agent.post('/api/songs').send({ title: 'Long Reel', meter: '4/4', goalBpm: 120 }).expect(201)
  ).body;
  const rec = (
    await player.agent
      .post(`/api/songs/${song.id}/recordings`)
      .field('kind', 'reference')
      .attach('file', wav, 'long-reel.wav')
      .expect(201)
  ).body;
  const done = await waitForAnalysis(player.agent, rec.id, 180_000);
  expect(done.status).toBe('done');
  return { player, song, rec: done as { id: string; analysis: { beats: number[]; downbeats: number[] } } };
}

/** The bar numbers drawn in the detail view, with their boxes. */
async function barNumbers(page: Page) {
  return page.locator('[data-testid="player-waveform"] [data-testid^="bar-number-"]').evaluateAll((els) =>
    els.map((e) => {
      const r = e.getBoundingClientRect();
      return { bar: Number(e.textContent), left: r.left, right: r.right };
    }),
  );
}

/** No two bar numbers overlap (labels on a time axis must stay readable: common practice). */
async function expectNoOverlap(page: Page) {
  const labels = (await barNumbers(page)).sort((a, b) => a.left - b.left);
  expect(labels.length).toBeGreaterThan(1);
  for (let i = 1; i < labels.length; i++) expect(labels[i]!.left).toBeGreaterThanOrEqual(labels[i - 1]!.right);
}

async function position(page: Page): Promise<number> {
  const m = /^(\d+):(\d+(?:\.\d+)?)$/.exec(((await page.getByTestId('playback-position').textContent()) ?? '').trim());
  if (!m) throw new Error('no position readout');
  return Number(m[1]) * 60 + Number(m[2]);
}

/** x on screen of bar `n`'s line in the detail view (its number sits 3 px right of it). */
async function barX(page: Page, n: number) {
  const box = await page.locator(`[data-testid="player-waveform"] [data-testid="bar-number-${n}"]`).boundingBox();
  if (!box) throw new Error(`bar ${n} is not numbered in the view`);
  return box.x - 3;
}

type Audition = { tactusAudition: { grid: { beats: number[]; downbeats: number[]; originalBpm: number } } };
const playerGrid = (page: Page) => page.evaluate(() => (window as unknown as Audition).tactusAudition.grid);

test('on a phone: bars 57–60 of a 4-minute song found, named, kept, looped and stepped up; the compact transport; the beat halved and bar 1 moved', async () => {
  const { player, song, rec } = await longSong('long-phone');
  const downbeats = rec.analysis.downbeats;
  // The engine finds every accented bar start of the click track (within 20 ms: the onset frames' resolution).
  expect(downbeats.length).toBeGreaterThanOrEqual(118);
  expect(Math.abs(downbeats[56]! - (0.5 + 56 * 2))).toBeLessThan(0.02);

  const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await signInThroughApp(page, player.email, PASSWORD);
  await page.goto(`${baseUrl}/recordings/${rec.id}`);
  await page.getByTestId('play').filter({ hasText: 'Play' }).waitFor();
  await page.waitForFunction(
    () => document.querySelector('[data-testid="play"]')?.getAttribute('aria-disabled') !== 'true',
  );

  await page.getByTestId('zoom-all').click();
  await expectNoOverlap(page);
  // Zoomed out over 120 bars at phone width: no beat lines, bar numbers thinned to every 16th or 32nd bar.
  expect((await barNumbers(page)).length).toBeLessThanOrEqual(12);
  await page.screenshot({ path: path.join(outputDir, 'long-song-phone-zoomed-out.png') });

  // To bar 57, then 16 seconds (8 bars) across the phone. The screen is first scrolled as a phone's keyboard leaves
  // it, the field at the top and the waveform above it out of sight: going to the bar brings the whole waveform,
  // bar numbers and all, back into view below the top bar, and closes the keyboard.
  // The position readout before bar 1 (no bar, no beat yet), measured to compare with bar 57's below.
  const readout = async () => {
    const box = (await page.getByTestId('position-readout').boundingBox())!;
    const clock = (await page.getByTestId('playback-position').boundingBox())!;
    return { height: box.height, clockX: clock.x - box.x };
  };
  expect(await page.getByTestId('playback-bar').textContent()).toBe('–');
  const readoutBefore = await readout();
  await page.getByTestId('go-to-bar').evaluate((e) => e.scrollIntoView({ block: 'start' }));
  const screenTop = async () => (await page.getByTestId('recording').boundingBox())!.y;
  const overviewTop = async () => (await page.getByTestId('waveform-overview').boundingBox())!.y;
  expect(await overviewTop()).toBeLessThan(await screenTop());
  await page.getByTestId('go-to-bar').fill('57');
  await page.getByTestId('go-to-bar').press('Enter');
  await page.getByTestId('playback-bar').filter({ hasText: /^57$/ }).waitFor();
  expect(await overviewTop()).toBeGreaterThanOrEqual(await screenTop());
  expect(await page.getByTestId('go-to-bar').evaluate((e) => e === document.activeElement)).toBe(false);
  // A bar number and a beat appearing move nothing: the readout keeps its height and the clock its place.
  await page.getByTestId('playback-beat').filter({ hasText: /^1$/ }).waitFor();
  expect(await readout()).toEqual(readoutBefore);
  // Read from a music stand: the bar number is set large (44 px here; body text is 16 px).
  expect(
    await page.getByTestId('playback-bar').evaluate((e) => parseFloat(getComputedStyle(e).fontSize)),
  ).toBeGreaterThanOrEqual(40);
  // From the whole song (240 s) six halvings reach the two-bar floor (4 s); one step back out is 8 s.
  for (let i = 0; i < 6; i++) await page.getByTestId('zoom-in').click();
  await page.getByTestId('zoom-out').click();
  await page
    .getByTestId('zoom-readout')
    .filter({ hasText: '8 s shown' })
    .waitFor()
    .catch(async () => {
      throw new Error(`zoom readout says ${await page.getByTestId('zoom-readout').textContent()}`);
    });
  await page.getByTestId('zoom-out').click();
  await page.getByTestId('zoom-readout').filter({ hasText: '16 s shown' }).waitFor();
  // Going to a bar puts it near the left edge, with the bars after it in view.
  await page.getByTestId('go-to-bar').press('Enter');
  await expectNoOverlap(page);
  const labels = (await barNumbers(page)).map((l) => l.bar);
  expect(labels).toEqual(expect.arrayContaining([57, 58, 59, 60, 61]));
  await page.screenshot({ path: path.join(outputDir, 'long-song-phone-zoomed-in.png') });

  // Drag from just inside bar 57 to just before bar 61: the passage snaps to bars 57–60.
  const wave = (await page.getByTestId('player-waveform').boundingBox())!;
  const y = wave.y + wave.height / 2;
  const x57 = await barX(page, 57);
  const x61 = await barX(page, 61);
  await page.mouse.move(x57 + 6, y);
  await page.mouse.down();
  await page.mouse.move((x57 + x61) / 2, y, { steps: 5 });
  await page.mouse.move(x61 - 6, y, { steps: 5 });
  await page.mouse.up();
  await page.getByTestId('loop-label').filter({ hasText: 'Looping bars 57–60' }).waitFor();

  await page.getByTestId('passage-name').fill('bridge');
  await page.getByTestId('save-passage').click();
  await page.getByTestId('passage-bridge').waitFor();
  await page.getByTestId('loop-label').filter({ hasText: 'Looping bridge' }).waitFor();
  const passages = (await player.agent.get(`/api/songs/${song.id}/passages`).expect(200)).body.passages;
  expect(passages).toHaveLength(1);
  expect(passages[0]).toMatchObject({ name: 'bridge', recordingId: rec.id, startBar: 57, endBar: 60 });
  expect(passages[0].startSec).toBeCloseTo(downbeats[56]!, 3);
  expect(passages[0].endSec).toBeCloseTo(downbeats[60]!, 3);

  // After a reload the passage is listed and the last loop is back.
  await page.reload();
  await page.getByTestId('passage-bridge').getByText('bars 57–60', { exact: false }).waitFor();
  await page.getByTestId('loop-label').filter({ hasText: 'Looping bridge' }).waitFor();
  await page.getByTestId('loop-label').getByText('Looping bridge').waitFor();
  // Stop, then one tap on the saved passage loops it again.
  await page.getByRole('button', { name: 'Stop looping' }).click();
  await page.getByTestId('loop-passage-bridge').click();
  await page.getByTestId('loop-label').filter({ hasText: 'Looping bridge' }).waitFor();

  // Step up twice: 100 → 105 → 110 BPM, one clean pass per step (three passes of 16 beats).
  await page.getByTestId('play').filter({ hasText: 'Play' }).waitFor();
  await page.waitForFunction(
    () => document.querySelector('[data-testid="play"]')?.getAttribute('aria-disabled') !== 'true',
  );
  await page.waitForFunction(
    () => document.querySelector('[data-testid="play"]')?.getAttribute('aria-disabled') !== 'true',
  );
  await page.getByTestId('stepup-startBpm').fill('100');
  await page.getByTestId('stepup-stepBpm').fill('5');
  await page.getByTestId('stepup-repsPerStep').fill('1');
  await page.getByTestId('stepup-goalBpm').fill('110');
  await page.getByTestId('start-stepup').click();
  await page.getByTestId('stepup-status').getByText('Goal reached: 110 BPM').waitFor({ timeout: 60_000 });
  await page.getByText(/^Logged: bridge, 100 → 110 BPM, 3 repetitions/).waitFor();
  const entries = (await player.agent.get(`/api/songs/${song.id}/practice`).expect(200)).body.entries;
  expect(entries[0]).toMatchObject({
    passageId: passages[0].id,
    recordingId: rec.id,
    startBar: 57,
    endBar: 60,
    startBpm: 100,
    reachedBpm: 110,
    repetitions: 3,
    clean: true,
  });
  await page
    .getByTestId('practice-log')
    .getByText(/bridge \(bars 57–60\)/)
    .waitFor();
  // The clean run at 110 offers to raise the passage's working tempo; taken, it shows in the list.
  await page.getByTestId('raise-offer').getByText('Raise the working tempo of “bridge” to 110 BPM').click();
  await page
    .getByTestId('passage-bridge')
    .getByText(/working 110/)
    .waitFor();

  // The passage's own tempos, set and cleared in its row: a tempo out of range is refused in plain words and
  // nothing is saved; an empty field clears that tempo.
  await page.getByTestId('passage-tempos-bridge').click();
  const editor = page.getByTestId('passage-tempo-editor-bridge');
  await editor.getByTestId('passage-working').fill('12');
  await editor.getByTestId('save-passage-tempos').click();
  await editor.getByText('Working tempo must be at least 30 BPM').waitFor();
  await editor.scrollIntoViewIfNeeded();
  await page.screenshot({ path: path.join(outputDir, 'long-song-phone-passage-tempos.png') });
  expect((await player.agent.get(`/api/songs/${song.id}/passages`).expect(200)).body.passages[0]).toMatchObject({
    workingBpm: 110,
    goalBpm: 120,
  });
  await editor.getByTestId('passage-working').fill('104,5');
  await editor.getByTestId('passage-goal').fill('');
  await editor.getByTestId('save-passage-tempos').click();
  await editor.waitFor({ state: 'detached' });
  await page
    .getByTestId('passage-bridge')
    .getByText(/working 104\.5/)
    .waitFor();
  const afterEdit = (await player.agent.get(`/api/songs/${song.id}/passages`).expect(200)).body.passages[0];
  expect(afterEdit).toMatchObject({ workingBpm: 104.5, goalBpm: null });
  expect(await page.getByTestId('passage-bridge').textContent()).not.toContain('goal');

  // Scrolled down to the candidates, the compact transport is still on screen and plays.
  await page.getByTestId('candidates').scrollIntoViewIfNeeded();
  const bar = (await page.getByTestId('compact-transport').boundingBox())!;
  const nav = (await page.getByRole('navigation', { name: 'Main' }).boundingBox())!;
  expect(bar.y + bar.height).toBeLessThanOrEqual(nav.y + 1);
  expect(bar.y).toBeGreaterThan(0);
  await page.getByTestId('play-compact').click();
  await page.getByTestId('play-compact').filter({ hasText: 'Pause' }).waitFor();
  await page.getByTestId('play-compact').click();
  await page.getByTestId('play-compact').filter({ hasText: 'Play' }).waitFor();

  // Halve: 60 BPM; every other beat, a bar of four felt beats spans two found bars, so felt bar 29 starts where
  // found bar 57 did; the click's grid (the player's) is the halved one.
  const before = await playerGrid(page);
  const bpmShown = async () => parseFloat((await page.getByTestId('playback-bpm-compact').textContent()) ?? '');
  const bpmBefore = await bpmShown();
  // The player object is marked, to see it is the same one after the correction.
  await page.evaluate(() => ((window as unknown as { tactusAudition: { seen?: boolean } }).tactusAudition.seen = true));
  await page.getByTestId('level-half').click();
  await page.waitForFunction(() => (window as unknown as Audition).tactusAudition.grid.originalBpm === 60);
  await page.waitForFunction(
    (b) => parseFloat(document.querySelector('[data-testid="playback-bpm-compact"]')?.textContent ?? '') !== b,
    bpmBefore,
  );
  expect(
    await page.evaluate(() => (window as unknown as { tactusAudition: { seen?: boolean } }).tactusAudition.seen),
  ).toBe(true);
  // The same player takes the new grid (no second decode) at the same speed: the tempo shown is that speed on
  // the halved grid, half the number (to the tenth the player keeps).
  expect(Math.abs((await bpmShown()) - bpmBefore / 2)).toBeLessThanOrEqual(0.1);
  await page.getByTestId('play-compact').filter({ hasText: 'Play' }).waitFor();
  const halved = await playerGrid(page);
  expect(halved.originalBpm).toBe(60);
  expect(halved.beats.length).toBe(Math.ceil(before.beats.length / 2));
  expect(halved.beats[1]! - halved.beats[0]!).toBeCloseTo(1, 2);
  await page.getByTestId('go-to-bar').fill('29');
  await page.getByTestId('go-to-bar').press('Enter');
  await page.getByTestId('playback-bar').filter({ hasText: /^29$/ }).waitFor();
  expect(Math.abs((await position(page)) - downbeats[56]!)).toBeLessThan(0.06);

  // "This beat is one" on the second felt beat of bar 29: bar 1 moves one beat later. Zoomed to 16 s (four felt
  // bars) every bar is numbered.
  await page.getByTestId('zoom-all').click();
  for (let i = 0; i < 4; i++) await page.getByTestId('zoom-in').click();
  await page.getByTestId('zoom-readout').filter({ hasText: '15 s shown' }).waitFor();
  // In the middle of the screen, clear of the compact transport that sticks to the bottom of a phone's screen.
  await page.getByTestId('player-waveform').evaluate((el) => el.scrollIntoView({ block: 'center' }));
  await page.screenshot({ path: path.join(outputDir, 'long-song-phone-halved.png') });
  const wave2 = (await page.getByTestId('player-waveform').boundingBox())!;
  const x29 = await barX(page, 29);
  const x30 = await barX(page, 30);
  // The place before the tap, read before it: the readout may follow the tap at once.
  const beforeTap = await position(page);
  await page.mouse.click(x29 + (x30 - x29) / 4, wave2.y + wave2.height / 2); // one beat of four into bar 29
  await page.waitForFunction((t) => {
    const m = /^(\d+):(\d+\.\d)$/.exec(document.querySelector('[data-testid="playback-position"]')?.textContent ?? '');
    return !!m && Math.abs(Number(m[1]) * 60 + Number(m[2]) - t) > 0.3;
  }, beforeTap);
  const oneAt = await position(page);
  await page.getByTestId('beat-is-one').click();
  await page.waitForFunction(
    (t) => (window as unknown as Audition).tactusAudition.grid.downbeats.some((d) => Math.abs(d - t) < 0.3),
    oneAt,
  );
  const moved = await playerGrid(page);
  expect(moved.downbeats[0]).not.toBeCloseTo(halved.downbeats[0]!, 1);
  const saved = (await player.agent.get(`/api/recordings/${rec.id}`).expect(200)).body;
  expect(saved.beatLevel).toBe('half');
  expect(Math.abs(saved.barOneSec - (downbeats[56]! + 1))).toBeLessThan(0.06);

  expect(errors).toEqual([]);
  await context.close();
}, 400_000);

test('on a wide screen: the waveform and transport stay in view while the side column scrolls; zoomed out and in', async () => {
  const { player, rec } = await longSong('long-desktop');
  const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await signInThroughApp(page, player.email, PASSWORD);
  await page.goto(`${baseUrl}/recordings/${rec.id}`);
  await page.getByTestId('play').filter({ hasText: 'Play' }).waitFor();
  await page.waitForFunction(
    () => document.querySelector('[data-testid="play"]')?.getAttribute('aria-disabled') !== 'true',
  );

  await page.getByTestId('zoom-all').click();
  await expectNoOverlap(page);
  await page.screenshot({ path: path.join(outputDir, 'long-song-desktop-zoomed-out.png') });
  await page.getByTestId('go-to-bar').fill('57');
  await page.getByTestId('go-to-bar').press('Enter');
  for (let i = 0; i < 6; i++) await page.getByTestId('zoom-in').click();
  await page
    .getByTestId('zoom-readout')
    .filter({ hasText: '4 s shown' })
    .waitFor({ timeout: 5000 })
    .catch(async () => {
      throw new Error(`zoom readout says ${await page.getByTestId('zoom-readout').textContent()}`);
    });
  await expectNoOverlap(page);
  expect((await barNumbers(page)).map((l) => l.bar)).toContain(57);
  await page.screenshot({ path: path.join(outputDir, 'long-song-desktop-zoomed-in.png') });

  // Scrolled to the export card at the foot of the side column, the waveform and Play are still on screen.
  await page.getByTestId('export-recording').scrollIntoViewIfNeeded();
  for (const id of ['player-waveform', 'play']) {
    const box = (await page.getByTestId(id).boundingBox())!;
    expect(box.y).toBeGreaterThanOrEqual(0);
    expect(box.y + box.height).toBeLessThanOrEqual(900);
  }
  await page.screenshot({ path: path.join(outputDir, 'long-song-desktop-scrolled.png') });
  expect(errors).toEqual([]);
  await context.close();
}, 300_000);
