// Debian's Chromium driven by playwright-core (no browser download): the flags keep it off the network.
// playwright gives every launch a fresh, empty profile of its own.
import fs from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type Locator, type Page } from 'playwright-core';
import { baseUrl } from '@/tests/api/helpers';

export const outputDir = path.resolve(__dirname, '../../test-output');

/** `extraArgs`: flags for one test only (e.g. the fake microphone of the recording test). */
export async function launchChromium(extraArgs: string[] = []): Promise<Browser> {
  fs.mkdirSync(outputDir, { recursive: true });
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      // Audio may start without a gesture in tests; a real listener clicks Play anyway.
      '--autoplay-policy=no-user-gesture-required',
      ...extraArgs,
    ],
  });
}

export const viewports = [
  { name: 'phone', width: 390, height: 844 },
  { name: 'desktop', width: 1280, height: 800 },
] as const;

/** Signs in through the app's own sign-in screen and waits for the library. */
export async function signInThroughApp(page: Page, email: string, password: string) {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByTestId('email').fill(email);
  await page.getByTestId('password').fill(password);
  await page.getByTestId('sign-in').click();
  await page.getByTestId('library').waitFor();
}

/**
 * A screenshot of one element that a layout change (a new viewport width) may still be re-mounting: taken
 * again, a few times, once the element is attached anew.
 */
export async function screenshotOf(element: Locator, file: string) {
  for (let attempt = 1; ; attempt++) {
    try {
      await element.screenshot({ path: file });
      return;
    } catch (e) {
      if (attempt >= 4 || !/not attached/.test((e as Error).message)) throw e;
      await element.waitFor();
    }
  }
}
