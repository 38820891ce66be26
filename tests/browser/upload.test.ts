// Uploading a take through the app in a real browser: the upload's progress, the analysis, then the tempo
// and the waveform with its beat grid. The clip's truth is its tempo map: 124 BPM (fixtures/pieces.ts).
import path from 'node:path';
import type { Browser } from 'playwright-core';
import { launchChromium, outputDir, signInThroughApp, viewports } from './chromium';
import { PASSWORD, signedInUser } from '@/tests/api/helpers';

const CLIP = path.resolve(__dirname, '../../fixtures/clips/drums-bass-124.mp3');
let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

describe.each(viewports)('upload at $name width', (viewport) => {
  test('pick a file, watch it upload and analyse, see the tempo and the waveform', async () => {
    const player = await signedInUser(`upload-ui-${viewport.name}`);
    const song = (
      await player.agent
        .post('/api/songs')
        .send({ title: 'Copperline Reel', meter: '4/4', goalBpm: 128, workingBpm: 110 })
        .expect(201)
    ).body;

    const context = await browser.newContext({ viewport: { width: viewport.width, height: viewport.height } });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await signInThroughApp(page, player.email, PASSWORD);
    await page.getByText('Copperline Reel').click();
    await page.getByTestId('song').waitFor();
    await page.getByText('No recordings yet').waitFor();

    // A slow uplink (about 150 kB/s), so the upload lasts long enough to be watched.
    const cdp = await context.newCDPSession(page);
    await cdp.send('Network.emulateNetworkConditions', {
      offline: false,
      latency: 20,
      downloadThroughput: -1,
      uploadThroughput: 150 * 1024,
    });
    await page.getByTestId('file-input').setInputFiles(CLIP);
    await page.getByText('drums-bass-124.mp3').waitFor();
    await page.getByTestId('recording-label').fill('Groove at home');
    await page.getByTestId('upload').click();
    await page.getByTestId('upload-progress').waitFor();
    // The bar moves while the bytes go out.
    await page.waitForFunction(
      () => Number(document.querySelector('[data-testid="upload-progress"]')?.getAttribute('aria-valuenow') ?? 0) > 20,
    );
    await page.screenshot({ path: path.join(outputDir, `upload-progress-${viewport.name}.png`) });

    await page.getByTestId('recording').waitFor({ timeout: 30_000 });
    await page.getByTestId('tempo-result').waitFor({ timeout: 30_000 });
    const bpm = Number((await page.getByTestId('detected-bpm').innerText()).replace(/[^\d.]/g, ''));
    expect(Math.abs(bpm - 124)).toBeLessThanOrEqual(124 * 0.04);
    await page.getByTestId('waveform').waitFor();
    await page.getByText('4/4').first().waitFor();
    await page.screenshot({ path: path.join(outputDir, `recording-result-${viewport.name}.png`), fullPage: true });

    // The player feels the beat at half the level found: the tempo shown halves and the choice is stored.
    await page.getByTestId('level-half').click();
    await page.getByText('Tempo (the beat you feel)').waitFor();
    const halved = Number((await page.getByTestId('detected-bpm').innerText()).replace(/[^\d.]/g, ''));
    expect(halved).toBeCloseTo(bpm / 2, 0);
    const saved = (await player.agent.get(`/api/songs/${song.id}/recordings`).expect(200)).body.recordings[0];
    expect(saved.beatLevel).toBe('half');
    expect(errors).toEqual([]);
    await context.close();
  });
});
