// Runs in a worker thread: fetch the stored file, decode it, run the tempo engine, compute waveform peaks.
// The heavy work stays off the request thread; the parent stores the result (jobs/runner.ts).
import fs from 'node:fs';
import path from 'node:path';
import crypto from 'node:crypto';
import { pipeline } from 'node:stream/promises';
import { parentPort } from 'node:worker_threads';
import { analyse } from '@/audio/analysis/analyse';
import type { Analysis } from '@/shared/analysis';
import { waveformPeaks } from '@/audio/analysis/peaks';
import { ENGINE_VERSION } from '@/audio/analysis/version';
import { decodeFile } from '@/server/analysis/decode';
import { runInBackground } from '@/server/analysis/thread-priority';
import { objectStore } from '@/server/storage';
import { config } from '@/server/config';

export interface WorkRequest {
  storageKey: string;
}
export type WorkMessage =
  | { type: 'progress'; value: number }
  | {
      type: 'done';
      result: Analysis;
      peaks: ReturnType<typeof waveformPeaks>;
      engineMs: number;
      engineVersion: number;
    }
  | { type: 'failed'; reason: string };

const post = (m: WorkMessage) => parentPort!.postMessage(m);
/** Test knob only (the interruption tests need a job that is still running when they kill the process). */
const testDelayMs = Number(process.env.TACTUS_ANALYSIS_TEST_DELAY_MS ?? 0);

runInBackground();

parentPort!.on('message', async ({ storageKey }: WorkRequest) => {
  const temp = path.join(config.storage.spoolDir, `.analysis-${crypto.randomBytes(8).toString('hex')}`);
  try {
    fs.mkdirSync(config.storage.spoolDir, { recursive: true });
    await pipeline(await objectStore().read(storageKey), fs.createWriteStream(temp));
    post({ type: 'progress', value: 0.2 });
    const { samples, sampleRate } = await decodeFile(temp);
    post({ type: 'progress', value: 0.5 });
    if (testDelayMs) await new Promise((r) => setTimeout(r, testDelayMs));
    const started = performance.now();
    const result = await analyse(samples, sampleRate);
    const peaks = waveformPeaks(samples, sampleRate);
    post({
      type: 'done',
      result,
      peaks,
      engineMs: Math.round(performance.now() - started),
      engineVersion: ENGINE_VERSION,
    });
  } catch (err) {
    post({ type: 'failed', reason: `analysis failed: ${(err as Error).message}` });
  } finally {
    fs.rmSync(temp, { force: true });
  }
});
