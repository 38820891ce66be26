// The development reference page of the API (/api/docs) renders in Chromium from this server alone: every
// documented operation is shown, nothing is fetched from anywhere else, and no script fails.
import path from 'node:path';
import request from 'supertest';
import type { Browser } from 'playwright-core';
import { launchChromium, outputDir } from './chromium';
import { baseUrl, documentedOperations } from '@/tests/api/helpers';

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

test('the reference page shows every documented operation, served from this server only', async () => {
  const doc = (await request(baseUrl).get('/api/openapi.json').expect(200)).body;
  const page = await browser.newPage({ viewport: { width: 1280, height: 1600 } });
  const elsewhere: string[] = [];
  const failed: string[] = [];
  const errors: string[] = [];
  page.on('request', (r) => {
    if (!r.url().startsWith(baseUrl) && !r.url().startsWith('data:')) elsewhere.push(r.url());
  });
  page.on('requestfailed', (r) => failed.push(r.url()));
  page.on('pageerror', (e) => errors.push(e.message));
  await page.goto(`${baseUrl}/api/docs`, { waitUntil: 'networkidle' });
  await page.locator('.opblock').first().waitFor();

  // swagger-ui draws one .opblock per operation, its method and path in .opblock-summary-method / -path.
  const shown = await page
    .locator('.opblock-summary')
    .evaluateAll((els) =>
      els.map(
        (el) =>
          `${el.querySelector('.opblock-summary-method')?.textContent?.trim()} ${el.querySelector('.opblock-summary-path')?.getAttribute('data-path')}`,
      ),
    );
  expect(shown.sort()).toEqual(documentedOperations(doc).sort());
  expect(await page.locator('.info .title').innerText()).toContain('Tactus API');
  await page.screenshot({ path: path.join(outputDir, 'api-reference.png') });
  expect({ elsewhere, failed, errors }).toEqual({ elsewhere: [], failed: [], errors: [] });
  await page.close();
});
