// Runs in a worker thread of check-pool.ts: one upload check at a time, its answer posted back. Refusals
// (HttpError) travel as plain data; anything else is a failure the server reports as its own error.
import { parentPort } from 'node:worker_threads';
import { HttpError } from '@/server/http';
import { checkAudio, type CheckedAudio } from './audio-check';
import { runInBackground } from './thread-priority';

export interface CheckRequest {
  id: number;
  file: string;
  maxDurationSec: number;
}

export type CheckReply =
  | { id: number; ok: true; audio: CheckedAudio }
  | {
      id: number;
      ok: false;
      refused?: { status: number; code: string; message: string; field?: string };
      failure: string;
    };

runInBackground();

parentPort!.on('message', async ({ id, file, maxDurationSec }: CheckRequest) => {
  let reply: CheckReply;
  try {
    reply = { id, ok: true, audio: await checkAudio(file, maxDurationSec) };
  } catch (err) {
    reply =
      err instanceof HttpError
        ? {
            id,
            ok: false,
            refused: { status: err.status, code: err.code, message: err.message, field: err.field },
            failure: err.message,
          }
        : { id, ok: false, failure: (err as Error).message };
  }
  parentPort!.postMessage(reply);
});
