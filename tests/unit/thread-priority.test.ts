// The check and analysis workers lower their own thread's priority only: the request thread keeps its own,
// and the ffmpeg a worker starts inherits the lower one (on Linux the nice value is per thread: setpriority(2)).
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Worker } from 'node:worker_threads';
import { BACKGROUND_NICE } from '@/server/analysis/thread-priority';

const niceOfThread = (tid: string) =>
  Number(fs.readFileSync(`/proc/self/task/${tid}/stat`, 'utf8').split(') ')[1]!.split(' ')[16]);
const threadNices = () => fs.readdirSync('/proc/self/task').map(niceOfThread);

(process.platform === 'linux' ? test : test.skip)(
  'a worker that runs in the background is niced alone, and so is what it starts',
  async () => {
    const own = os.getPriority();
    const module = path.join(__dirname, '../../server/analysis/thread-priority.ts');
    const worker = new Worker(
      `require('tsx/cjs');
       require(${JSON.stringify(module)}).runInBackground();
       const { execFileSync } = require('node:child_process');
       const child = execFileSync('sh', ['-c', 'cut -d" " -f19 /proc/self/stat']).toString().trim();
       require('node:worker_threads').parentPort.postMessage(Number(child));`,
      { eval: true },
    );
    const childNice = await new Promise<number>((resolve, reject) => {
      worker.once('message', resolve);
      worker.once('error', reject);
    });
    const nices = threadNices();
    await worker.terminate();
    expect(childNice).toBe(own + BACKGROUND_NICE);
    expect(nices.filter((n) => n === own + BACKGROUND_NICE)).toHaveLength(1);
    expect(os.getPriority()).toBe(own);
    // Nothing left niced once the worker is gone.
    expect(threadNices().every((n) => n === own)).toBe(true);
    expect(execFileSync('sh', ['-c', 'cut -d" " -f19 /proc/self/stat']).toString().trim()).toBe(String(own));
  },
);
