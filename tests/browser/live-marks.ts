// The fake microphone (or a refused one) and the live view's marks, for the browser tests of recording a take
// and playing along.
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launchChromium } from './chromium';

/** Chromium with a fake microphone fed from `wavFile` (restarted from its start each time it is opened). */
export function launchWithFakeMicrophone(wavFile: string): Promise<Browser> {
  return launchChromium([
    '--use-fake-device-for-media-stream',
    '--use-fake-ui-for-media-stream',
    `--use-file-for-fake-audio-capture=${wavFile}`,
  ]);
}

/** Every page of `context` refuses the microphone as the browser does after the player said no to its prompt. */
export async function refuseMicrophone(context: BrowserContext): Promise<void> {
  await context.addInitScript(() => {
    navigator.mediaDevices.getUserMedia = () =>
      Promise.reject(new DOMException('Permission denied', 'NotAllowedError'));
  });
}

/** Collects every live mark as it appears (the card shows only the last few), by its spoken label. */
export async function watchLiveMarks(page: Page) {
  await page.evaluate(() => {
    const w = window as unknown as { seenMarks: string[] };
    w.seenMarks = [];
    new MutationObserver((records) => {
      for (const r of records)
        r.addedNodes.forEach((n) => {
          if (!(n instanceof HTMLElement)) return;
          const marks = n.matches('[data-testid="live-mark"]')
            ? [n]
            : Array.from(n.querySelectorAll<HTMLElement>('[data-testid="live-mark"]'));
          for (const m of marks) w.seenMarks.push(m.getAttribute('aria-label') ?? '');
        });
    }).observe(document.body, { childList: true, subtree: true });
  });
}

/** The labels collected by `watchLiveMarks` so far, in the order the marks appeared. */
export const seenLiveMarks = (page: Page): Promise<string[]> =>
  page.evaluate(() => (window as unknown as { seenMarks: string[] }).seenMarks);
