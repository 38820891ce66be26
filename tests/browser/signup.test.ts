// A new player, in a real browser against the exported web build served by the real server: sign up, open
// the confirmation mail from the catcher, sign in and see the empty library. Screenshots go to test-output/.
import path from 'node:path';
import type { Browser } from 'playwright-core';
import { launchChromium, outputDir, viewports } from './chromium';
import { linkPath, uniqueEmail, waitForMail, baseUrl } from '@/tests/api/helpers';

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

describe.each(viewports)('first visit at $name width', (viewport) => {
  test('sign up, confirm by e-mail, sign in, see the empty library', async () => {
    const context = await browser.newContext({ viewport: { width: viewport.width, height: viewport.height } });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));

    const email = uniqueEmail(`browser-${viewport.name}`);
    const password = 'clean-at-eighty';

    await page.goto(`${baseUrl}/`);
    // Signed out, the library sends the visitor to sign-in.
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    await page.getByText('Create an account').click();
    await page.getByRole('heading', { name: 'Create your account' }).waitFor();
    await page.getByTestId('name').fill('Wren Calloway');
    await page.getByTestId('email').fill(email);
    await page.getByTestId('password').fill(password);
    await page.getByTestId('sign-up').click();
    await page.getByTestId('check-email').waitFor();
    await page.getByText(email).waitFor();

    const mail = await waitForMail(email, /confirm your e-mail/i);
    await page.goto(`${baseUrl}${linkPath(mail)}`);
    await page.getByText('Your e-mail is confirmed').waitFor();

    await page.getByTestId('email').fill(email);
    await page.getByTestId('password').fill(password);
    await page.getByTestId('sign-in').click();
    await page.getByTestId('library').waitFor();
    await page.getByText('Your library is empty').waitFor();
    await page.getByRole('link', { name: 'Library' }).waitFor();
    // Players do not see the teachers' page.
    expect(await page.getByRole('link', { name: 'Students' }).count()).toBe(0);

    await page.screenshot({ path: path.join(outputDir, `first-visit-library-${viewport.name}.png`) });
    expect(errors).toEqual([]);
    await context.close();
  });
});
