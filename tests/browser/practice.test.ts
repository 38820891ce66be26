// The practice log in the browser, on a phone (390 px) and at a desk (1280 px): a song with a passage and a
// working tempo its teacher set, two sessions logged by hand at rising tempos (the chart's caption moves), the
// offer to raise the working tempo naming the teacher, accepted and undone; a session on the passage draws its
// own chart; the duration planner's worked example; the week's summary; the CSV export read back with csv-parse.
// A session logged later, on yesterday: placed on its day by the chart and the log; refused days told why.
import fs from 'node:fs';
import path from 'node:path';
import { parse } from 'csv-parse/sync';
import type { Browser, Page } from 'playwright-core';
import { launchChromium, outputDir, signInThroughApp, viewports } from './chromium';
import { baseUrl, linkStudent, PASSWORD, signedInUser, waitForAnalysis } from '@/tests/api/helpers';
import { root } from '@/tests/setup/processes';

const clip = fs.readFileSync(path.join(root, 'fixtures/clips/drums-bass-124.mp3'));
let browser: Browser;

beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

const shot = (page: Page, name: string) =>
  page.screenshot({ path: path.join(outputDir, `${name}.png`), fullPage: true });

async function logByHand(
  page: Page,
  entry: { reached: string; clean: boolean; reps: string; minutes: string; note?: string; passage?: string },
) {
  const form = page.getByTestId('log-practice');
  if (entry.passage) await form.getByTestId(`log-passage-${entry.passage}`).click();
  await form.getByTestId('log-reached').fill(entry.reached);
  await form.getByTestId('log-repetitions').fill(entry.reps);
  await form.getByTestId('log-minutes').fill(entry.minutes);
  await form.getByTestId(entry.clean ? 'log-clean' : 'log-not-clean').click();
  if (entry.note) await form.getByTestId('log-note').fill(entry.note);
  await form.getByTestId('log-submit').click();
}

describe.each(viewports)('practice log at $width px', (viewport) => {
  test('log twice, see the chart move, raise and undo, plan a duration, read the week, export CSV', async () => {
    const player = await signedInUser(`practice-${viewport.name}`);
    const teacher = await signedInUser(`practice-teacher-${viewport.name}`, 'teacher');
    await linkStudent(teacher, player);
    const songId = (
      await player.agent
        .post('/api/songs')
        .send({ title: 'Saltmarsh Hornpipe', meter: '4/4', goalBpm: 112 })
        .expect(201)
    ).body.id;
    // The teacher sets the working tempo: the offer will say who set the one it replaces.
    await teacher.agent.patch(`/api/songs/${songId}/tempos`).send({ workingBpm: 90 }).expect(200);
    const recordingId = (
      await player.agent
        .post(`/api/songs/${songId}/recordings`)
        .field('kind', 'reference')
        .attach('file', clip, 'hornpipe.mp3')
        .expect(201)
    ).body.id;
    await waitForAnalysis(player.agent, recordingId);
    await player.agent
      .post(`/api/songs/${songId}/passages`)
      .send({ recordingId, name: 'the turn', startSec: 3.87, endSec: 7.74, startBar: 3, endBar: 4, workingBpm: 80 })
      .expect(201);

    const context = await browser.newContext({
      viewport: { width: viewport.width, height: viewport.height },
      acceptDownloads: true,
    });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await signInThroughApp(page, player.email, PASSWORD);
    await page.goto(`${baseUrl}/songs/${songId}`);
    await page.getByTestId('log-practice').waitFor();

    // First session: 92 BPM, not yet clean: the chart shows one point, and nothing is offered.
    await logByHand(page, { reached: '92', clean: false, reps: '4', minutes: '10', note: 'slow, then "faster"' });
    const songChart = page.getByTestId('practice-chart-song');
    await songChart.getByText('1 session over 1 day; the last reached 92 BPM, not yet clean.').waitFor();
    expect(await page.getByTestId('raise-offer').count()).toBe(0);

    // Second session: 96 BPM clean: the chart's last value moves, and the raise is offered over the teacher's 90.
    await logByHand(page, { reached: '96', clean: true, reps: '6', minutes: '15' });
    await songChart.getByText('2 sessions over 1 day; the last reached 96 BPM, clean.').waitFor();
    const offer = page.getByTestId('raise-offer');
    await offer.getByText(`Now 90 BPM, set by Test practice-teacher-${viewport.name}.`).waitFor();
    await page.getByTestId('practice-progress').scrollIntoViewIfNeeded();
    await page.getByTestId('practice-progress').screenshot({
      path: path.join(outputDir, `practice-chart-${viewport.name}.png`),
    });
    await offer.getByTestId('accept-raise').click();
    await offer.getByText('Raised the working tempo to 96 BPM.').waitFor();
    expect((await player.agent.get(`/api/songs/${songId}`).expect(200)).body.workingBpm).toBe(96);
    await offer.getByTestId('undo-raise').click();
    await offer.getByText('The working tempo is back at 90 BPM.').waitFor();
    const after = (await player.agent.get(`/api/songs/${songId}`).expect(200)).body;
    expect(after).toMatchObject({ workingBpm: 90, workingSetBy: { id: teacher.id } });
    // The song's header says again that the teacher set it.
    await page.getByText(new RegExp(`^Working tempo 90 set by Test practice-teacher-${viewport.name}`)).waitFor();

    // A clean session on the passage draws the passage's own chart and offers the passage's raise.
    await logByHand(page, { passage: 'the turn', reached: '84', clean: true, reps: '8', minutes: '6' });
    await page
      .getByTestId('practice-chart-passage-the turn')
      .getByText('1 session over 1 day; the last reached 84 BPM, clean.')
      .waitFor();
    await page.getByTestId('raise-offer').getByTestId('accept-raise').click();
    await page.getByText('Raised the working tempo of “the turn” to 84 BPM.').waitFor();
    const passages = (await player.agent.get(`/api/songs/${songId}/passages`).expect(200)).body.passages;
    expect(passages[0].workingBpm).toBe(84);
    await page.getByTestId('log-practice').screenshot({
      path: path.join(outputDir, `practice-form-${viewport.name}.png`),
    });

    // The duration planner: 103 bars of 4/4 are 412 beats; into 3:30.0 they need 412 / 3.5 = 117.7 BPM
    // (the worked example of tests/unit/duration.test.ts).
    await page.getByTestId('planner-bars').fill('103');
    await page.getByTestId('planner-target').fill('3:30.0');
    await page
      .getByTestId('planner-fit')
      .getByText(/To last 3:30\.0: 117\.7 BPM/)
      .waitFor();

    // The week: 10 + 15 + 6 minutes on one song; the whole piece went from 92 (where it started) to 96 clean,
    // the passage from 84 (started there) to 84: no gain listed for it.
    await page.goto(`${baseUrl}/practice`);
    const thisWeek = page.getByTestId('week-this');
    await thisWeek.getByText('31 min · 1 song · 3 sessions').waitFor();
    await thisWeek.getByText('Saltmarsh Hornpipe: 92 → 96 BPM (+4)').waitFor();
    await page.getByTestId('week-summary').screenshot({
      path: path.join(outputDir, `practice-week-${viewport.name}.png`),
    });
    await shot(page, `practice-screen-${viewport.name}`);

    // The export downloads the whole log as CSV; csv-parse reads the quoted note back as it was typed.
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('export-csv').click()]);
    expect(download.suggestedFilename()).toMatch(/^practice-log-\d{4}-\d{2}-\d{2}\.csv$/);
    const rows = parse(fs.readFileSync((await download.path())!, 'utf8'), { columns: true }) as Record<
      string,
      string
    >[];
    expect(rows.map((r) => [r.passage, r['reached BPM'], r.clean, r.note])).toEqual([
      ['', '92', 'no', 'slow, then "faster"'],
      ['', '96', 'yes', ''],
      ['the turn', '84', 'yes', ''],
    ]);
    expect(errors).toEqual([]);
    await context.close();
  });
});

describe.each(viewports)('a session logged later at $width px', (viewport) => {
  test('yesterday’s forgotten session lands on its day; a future, far-back or unreadable day is refused', async () => {
    await clearOfMidnight();
    const player = await signedInUser(`practice-later-${viewport.name}`);
    const songId = (
      await player.agent.post('/api/songs').send({ title: 'Lantern Jig', meter: '6/8', goalBpm: 120 }).expect(201)
    ).body.id;
    const session = { startBpm: 96, reachedBpm: 100, repetitions: 4, minutes: 15, clean: true };
    await player.agent.post(`/api/songs/${songId}/practice`).send(session).expect(201);

    const context = await browser.newContext({ viewport: { width: viewport.width, height: viewport.height } });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await signInThroughApp(page, player.email, PASSWORD);
    await page.goto(`${baseUrl}/songs/${songId}`);
    const form = page.getByTestId('log-practice');
    await form.waitFor();
    const songChart = page.getByTestId('practice-chart-song');
    await songChart.getByText('1 session over 1 day; the last reached 100 BPM, clean.').waitFor();

    // The day is the browser's date input (a phone's date picker), kept between a year back and today.
    const day = form.getByTestId('log-day');
    expect(await day.getAttribute('type')).toBe('date');
    expect(await day.getAttribute('max')).toBe(isoDay(0));
    expect(await day.getAttribute('min')).toBe(isoDay(-366));
    // Refused days (typed past the picker's ends, or cleared) say why under the field, and nothing is logged.
    const refused: [string, string][] = [
      [isoDay(+1), 'cannot be in the future'],
      [isoDay(-800), 'must be within the last year'],
      ['', 'choose the day it was played'],
    ];
    for (const [text, words] of refused) {
      await day.fill(text);
      await logByHand(page, { reached: '98', clean: true, reps: '3', minutes: '10' });
      await form.getByText(words).waitFor();
    }
    await shot(page, `practice-day-refused-${viewport.name}`);

    // Yesterday, by its chip: the chart now spans two days, and the log gives its day and when it was logged.
    await form.getByTestId('log-yesterday').click();
    await form.getByText(/^Yesterday, /).waitFor();
    await logByHand(page, { reached: '98', clean: true, reps: '3', minutes: '10', note: 'forgot to log it' });
    await form.getByText(/^Logged for .+: the whole piece at 98 BPM, clean\.$/).waitFor();
    // Oldest first on the chart: yesterday's 98, then today's 100 is the last.
    await songChart.getByText('2 sessions over 2 days; the last reached 100 BPM, clean.').waitFor();
    const log = page.getByTestId('practice-log');
    await log.getByText(/\(logged .+\)$/).waitFor();
    await log.screenshot({ path: path.join(outputDir, `practice-day-log-${viewport.name}.png`) });
    // The field is back on today for the next session.
    expect(await day.inputValue()).toBe(isoDay(0));
    const entries = (await player.agent.get(`/api/songs/${songId}/practice`).expect(200)).body.entries;
    expect(entries.map((e: { reachedBpm: number }) => e.reachedBpm)).toEqual([100, 98]);
    await page.getByTestId('log-practice').screenshot({
      path: path.join(outputDir, `practice-day-form-${viewport.name}.png`),
    });
    await page.getByTestId('practice-progress').screenshot({
      path: path.join(outputDir, `practice-day-chart-${viewport.name}.png`),
    });
    expect(errors).toEqual([]);
    await context.close();
    // Room for the wait past midnight (clearOfMidnight) besides the test itself.
  }, 120_000);
});

/**
 * The test reads "today" when it logs its first session and "yesterday" and "today" later: it starts at least a
 * minute clear of local midnight, waiting past it when closer, so both readings fall on the same day.
 */
async function clearOfMidnight() {
  const now = new Date();
  const untilMidnight = new Date(now.getFullYear(), now.getMonth(), now.getDate() + 1).getTime() - now.getTime();
  if (untilMidnight < 60_000) await new Promise((r) => setTimeout(r, untilMidnight + 1000));
}

/** The local day `days` from today as the day field writes it (the browser runs in this machine's zone). */
function isoDay(days: number): string {
  const d = new Date();
  d.setDate(d.getDate() + days);
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
}
