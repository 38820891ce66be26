// The demo studio that npm start seeds: a demo player signs in and sees their songs; the teacher sees students.
import { execFileSync } from 'node:child_process';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { launchChromium, outputDir, signInThroughApp, viewports } from './chromium';
import { DEMO_PASSWORD } from '@/server/demo-data';

const root = path.resolve(__dirname, '../..');
let browser: Browser;

beforeAll(async () => {
  // The seed script is the one npm start runs; twice in a row must be harmless.
  const seed = () =>
    execFileSync(path.join(root, 'node_modules/.bin/tsx'), [path.join(root, 'server/scripts/seed.ts')], {
      env: process.env, // the global set-up points the defaults at the test database and folders
      encoding: 'utf8',
    });
  expect(seed()).toMatch(/demo studio (seeded|already present)/);
  expect(seed()).toContain('demo studio already present');
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

const signIn = (page: Page, email: string) => signInThroughApp(page, email, DEMO_PASSWORD);

describe.each(viewports)('demo studio at $name width', (viewport) => {
  test('a demo player sees their songs with working, goal and chosen tempos', async () => {
    const context = await browser.newContext({ viewport: { width: viewport.width, height: viewport.height } });
    const page = await context.newPage();
    await signIn(page, 'ilya@harbourlane.example');
    await page.getByText('Copperline Reel').waitFor();
    await page.getByText('Lanterns over Kessel Bay').waitFor();
    // A table on a wide screen, cards on a phone.
    expect(await page.getByTestId(viewport.width >= 900 ? 'song-row' : 'song-card').count()).toBe(2);
    await page.getByText('E minor').first().waitFor();
    await page.screenshot({ path: path.join(outputDir, `demo-library-${viewport.name}.png`) });
    await context.close();
  });

  test('the demo player’s practice: two weeks of sessions on the chart of Copperline Reel', async () => {
    const context = await browser.newContext({ viewport: { width: viewport.width, height: viewport.height } });
    const page = await context.newPage();
    await signIn(page, 'ilya@harbourlane.example');
    await page.getByText('Copperline Reel').click();
    // The invented sessions of server/demo-data.ts: six, on six days, the last at 92 and not yet clean.
    const chart = page.getByTestId('practice-chart-song');
    await chart.getByText('6 sessions over 6 days; the last reached 92 BPM, not yet clean.').waitFor();
    await chart.scrollIntoViewIfNeeded();
    await chart.screenshot({ path: path.join(outputDir, `demo-practice-chart-${viewport.name}.png`) });
    await page.getByRole('link', { name: 'Practice' }).click();
    await page.getByTestId('week-summary').screenshot({
      path: path.join(outputDir, `demo-week-${viewport.name}.png`),
    });
    await context.close();
  });

  test('the demo teacher sees the Students page with three students', async () => {
    const context = await browser.newContext({ viewport: { width: viewport.width, height: viewport.height } });
    const page = await context.newPage();
    await signIn(page, 'marta@harbourlane.example');
    await page.getByRole('link', { name: 'Students' }).click();
    await page.getByTestId('students').waitFor();
    await page.getByText('Sanne Okafor').waitFor();
    await page.getByText('Tomás Reyes').waitFor();
    await page.screenshot({ path: path.join(outputDir, `demo-students-${viewport.name}.png`) });
    await context.close();
  });

  test('the demo admin changes a role on the Account page', async () => {
    const context = await browser.newContext({ viewport: { width: viewport.width, height: viewport.height } });
    const page = await context.newPage();
    await signIn(page, 'admin@harbourlane.example');
    await page.getByRole('link', { name: 'Account' }).click();
    await page.getByTestId('role-editor').waitFor();
    const group = page.getByRole('radiogroup', { name: 'Role of Tomás Reyes' });
    await group.getByRole('radio', { name: 'Teacher' }).click();
    await group.locator('[aria-checked="true"]').filter({ hasText: 'Teacher' }).waitFor();
    await page.screenshot({ path: path.join(outputDir, `demo-admin-roles-${viewport.name}.png`), fullPage: true });
    // Back as it was, for the other viewport's run.
    await group.getByRole('radio', { name: 'Player' }).click();
    await group.locator('[aria-checked="true"]').filter({ hasText: 'Player' }).waitFor();
    await context.close();
  });
});
