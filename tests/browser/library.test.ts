// The library and set lists in a real browser, on a phone (390 px) and at a desk (1280 px): a dozen songs, a
// search that finds one, a sort and a filter that change the list; then a set list of four songs (one with only
// an analysed tempo, one with no tempo at all), reordered, with its total length checked against hand arithmetic,
// and its stage view for print.
import fs from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { launchChromium, outputDir, signInThroughApp, viewports } from './chromium';
import { PASSWORD, signedInUser, waitForAnalysis } from '@/tests/api/helpers';
import { formatDuration } from '@/shared/format';

const CLIP = fs.readFileSync(path.resolve(__dirname, '../../fixtures/clips/drums-bass-124.mp3'));
let browser: Browser;
let player: Awaited<ReturnType<typeof signedInUser>>;
/** Beats the engine measured in the clip, and its tempo; every song with a recording has this clip. */
let beats: number;
let analysedBpm: number;

// Invented songs. "Ready to perform" = working tempo has reached the goal: Lanterns, Slate Roof, Tidewater.
const SONGS = [
  { title: 'Copperline Reel', composer: 'trad.', key: 'D major', goalBpm: 112, workingBpm: 88, chosenBpm: 124 },
  {
    title: 'Lanterns over Kessel Bay',
    composer: 'Ilya Brandt',
    key: 'E minor',
    meter: '6/8',
    goalBpm: 72,
    workingBpm: 72,
    chosenBpm: 70,
  },
  { title: 'Nine Steps Waltz', composer: 'Pieter Vahl', key: 'G major', meter: '3/4', goalBpm: 152, workingBpm: 126 },
  { title: 'Saltmarsh Air', composer: 'Wren Adeyemi', key: 'A minor', chosenBpm: 62 },
  { title: 'Slate Roof Nocturne', composer: 'Marta Quist', meter: '3/4', goalBpm: 66, workingBpm: 66 },
  { title: 'Ferry Bell Polka', composer: 'Anouk Stell', meter: '2/4', goalBpm: 120, workingBpm: 100, chosenBpm: 116 },
  { title: 'Gull Rock Hornpipe', composer: 'trad.', goalBpm: 100, workingBpm: 80 },
  {
    title: 'Tidewater Blues',
    composer: 'Jonah Pell',
    key: 'B♭',
    meter: '12/8',
    goalBpm: 90,
    workingBpm: 90,
    chosenBpm: 88,
  },
  { title: 'Quarry Lane March', composer: 'trad.', meter: '6/8', goalBpm: 116, workingBpm: 96 },
  { title: 'Moss and Granite', composer: 'Liesel Dorn', meter: '5/4', chosenBpm: 84 },
  { title: 'Harbour Lights Jig', composer: 'trad.', meter: '6/8', goalBpm: 126, workingBpm: 110 },
  { title: 'Windward Etude', composer: 'Sorrel Ames', goalBpm: 140, workingBpm: 92 },
];

beforeAll(async () => {
  player = await signedInUser('library-ui');
  const ids: Record<string, string> = {};
  for (const song of SONGS) ids[song.title] = (await player.agent.post('/api/songs').send(song).expect(201)).body.id;
  const uploads = [];
  // The hornpipe has a recording but no chosen tempo: the set list shows its analysed tempo, marked not chosen.
  for (const title of ['Copperline Reel', 'Saltmarsh Air', 'Gull Rock Hornpipe'])
    uploads.push(
      (
        await player.agent
          .post(`/api/songs/${ids[title]}/recordings`)
          .field('kind', 'reference')
          .attach('file', CLIP, 'band.mp3')
          .expect(201)
      ).body.id as string,
    );
  const analysed = await Promise.all(uploads.map((id) => waitForAnalysis(player.agent, id, 60_000)));
  beats = analysed[0].analysis.beatCount;
  analysedBpm = analysed[0].analysis.bpm;
  for (const a of analysed) expect(a.analysis).toMatchObject({ beatCount: beats, bpm: analysedBpm });
  browser = await launchChromium();
}, 120_000);
afterAll(async () => {
  await browser?.close();
});

/** Waits until the library shows exactly these titles, in this order. */
const waitForTitles = (page: Page, titles: string[]) =>
  page.waitForFunction(
    (want) =>
      JSON.stringify(
        [...document.querySelectorAll('[data-testid="library-song-title"]')].map((e) => (e as HTMLElement).innerText),
      ) === JSON.stringify(want),
    titles,
  );

describe.each(viewports)('library and set lists at $name width', (viewport) => {
  test('search, sort and filter a dozen songs; a set list of four, reordered, totalled and printed', async () => {
    const context = await browser.newContext({ viewport: { width: viewport.width, height: viewport.height } });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await signInThroughApp(page, player.email, PASSWORD);

    // All twelve, by title; a table at a desk, cards on a phone.
    await waitForTitles(page, [...SONGS.map((s) => s.title)].sort());
    expect(await page.getByTestId(viewport.width >= 900 ? 'song-row' : 'song-card').count()).toBe(12);
    await page.screenshot({ path: path.join(outputDir, `library-${viewport.name}.png`), fullPage: true });
    // Every sort and filter chip is wholly on screen (wrapped onto another line on a phone), none cut off at the edge.
    const chips = await page
      .locator('[data-testid^="sort-"], [data-testid^="status-"]')
      .evaluateAll((els) =>
        els.map((e) => ({ id: e.getAttribute('data-testid'), ...e.getBoundingClientRect().toJSON() })),
      );
    expect(chips.map((c) => c.id)).toContain('sort-progress');
    for (const c of chips) {
      expect(c.left).toBeGreaterThanOrEqual(0);
      expect(c.right).toBeLessThanOrEqual(viewport.width);
    }

    // Search by composer: one tap in the box, a few letters.
    await page.getByTestId('library-search').fill('vahl');
    await waitForTitles(page, ['Nine Steps Waltz']);
    await page.getByTestId('library-search').fill('');

    // Chosen tempo, slowest first; songs without one come last.
    await page.getByTestId('sort-chosenBpm').click();
    await waitForTitles(page, [
      'Saltmarsh Air',
      'Lanterns over Kessel Bay',
      'Moss and Granite',
      'Tidewater Blues',
      'Ferry Bell Polka',
      'Copperline Reel',
      'Gull Rock Hornpipe',
      'Harbour Lights Jig',
      'Nine Steps Waltz',
      'Quarry Lane March',
      'Slate Roof Nocturne',
      'Windward Etude',
    ]);
    // Ready to perform only, still by chosen tempo: Lanterns 70, Tidewater 88, then the nocturne without one.
    await page.getByTestId('status-ready').click();
    await waitForTitles(page, ['Lanterns over Kessel Bay', 'Tidewater Blues', 'Slate Roof Nocturne']);
    await page.getByText('Ready to perform: the working tempo has reached the goal tempo.').waitFor();
    await page.screenshot({ path: path.join(outputDir, `library-ready-${viewport.name}.png`), fullPage: true });

    // A set list of four: two with a chosen tempo and a recording, one with a recording but no chosen tempo, one
    // with neither.
    await page.getByRole('link', { name: 'Set lists' }).click();
    await page.getByTestId('set-lists').waitFor();
    await page.getByTestId('new-set-list-name').fill(`Harbour Lane, Friday (${viewport.name})`);
    await page.getByTestId('create-set-list').click();
    await page.getByTestId('set-list').waitFor();
    const titles = ['Copperline Reel', 'Saltmarsh Air', 'Gull Rock Hornpipe', 'Nine Steps Waltz'];
    for (const [i, title] of titles.entries()) {
      await page.getByRole('button', { name: `Add ${title}` }).click();
      await page.waitForFunction((n) => document.querySelectorAll('[data-testid="set-list-song"]').length === n, i + 1);
    }
    // A song lasts its beats at its chosen tempo: B beats at 124 BPM last B × 60 / 124 s, at 62 BPM twice as
    // long, B × 60 / 62 s. The hornpipe has no chosen tempo: its beats at the tempo they were measured at, A BPM,
    // B × 60 / A s, which makes the total an estimate. The waltz has no recording and is not counted.
    const hornpipeSec = (beats * 60) / analysedBpm;
    const total =
      `About ${formatDuration((beats * 180) / 124 + hornpipeSec)} in all, an estimate: 1 song at its analysed ` +
      'tempo, not a chosen one; not counting 1 song without a length';
    await page.getByTestId('set-list-total').filter({ hasText: total }).waitFor();
    expect(await page.getByTestId('set-list-song-length').allInnerTexts()).toEqual([
      formatDuration((beats * 60) / 124),
      formatDuration((beats * 60) / 62),
      `≈ ${formatDuration(hornpipeSec)} at the analysed tempo`,
      'no analysed recording, so no length',
    ]);
    // Never a bare dash: the analysed tempo marked as not chosen, or the words.
    expect(await page.getByTestId('set-list-song-tempo').evaluateAll((els) => els.map((e) => e.textContent))).toEqual([
      '124 BPM',
      '62 BPM',
      `≈ ${Math.round(analysedBpm)}BPM, not chosen`,
      'No tempo chosen',
    ]);

    // Reorder: the air to the top.
    await page.getByRole('button', { name: 'Move Saltmarsh Air up' }).click();
    await page.waitForFunction(() =>
      document.querySelector('[data-testid="set-list-song"]')?.textContent?.includes('Saltmarsh Air'),
    );
    await page.getByTestId('set-list-total').filter({ hasText: total }).waitFor();
    // The screen scrolls inside its own view: back to the top for the picture.
    await page.getByTestId('set-list').evaluate((el) => el.scrollTo(0, 0));
    await page.screenshot({ path: path.join(outputDir, `set-list-${viewport.name}.png`), fullPage: true });

    // The stage view: every click tempo large, in the new order; on paper the buttons are gone.
    await page.getByTestId('open-stage-view').click();
    await page.getByTestId('stage-view').waitFor();
    expect(await page.getByTestId('stage-tempo').allInnerTexts()).toEqual([
      '62\nBPM',
      '124\nBPM',
      `≈ ${Math.round(analysedBpm)}\nBPM, not chosen`,
      'No tempo chosen',
    ]);
    await page.getByTestId('stage-total').filter({ hasText: total }).waitFor();
    await page.screenshot({ path: path.join(outputDir, `set-list-stage-${viewport.name}.png`), fullPage: true });
    await page.emulateMedia({ media: 'print' });
    await page.locator('#stage-toolbar').waitFor({ state: 'hidden' });
    await page.screenshot({ path: path.join(outputDir, `set-list-print-${viewport.name}.png`), fullPage: true });

    // Back on the Set lists screen the new list reads its songs and total.
    await page.emulateMedia({ media: 'screen' });
    await page.getByRole('button', { name: '‹ Back' }).click();
    await page.getByTestId('set-list').waitFor();
    await page.getByRole('link', { name: 'Set lists' }).click();
    await page
      .getByTestId('set-list-card')
      .filter({ hasText: `Harbour Lane, Friday (${viewport.name})` })
      .waitFor();
    await page.screenshot({ path: path.join(outputDir, `set-lists-${viewport.name}.png`), fullPage: true });

    expect(errors).toEqual([]);
    await context.close();
  }, 90_000);
});
