// The upload checks and the analyses run below the thread that answers requests. On Linux the nice value
// belongs to each thread (setpriority(2), "Bugs"), so a worker thread that lowers its own leaves the request
// thread as it was, and the ffmpeg it starts inherits the lower priority. Measured before: while 20 uploads
// were checked and analysed, the request thread ran 4.6 s and waited 17 s for a CPU in 52 s.
import os from 'node:os';

/** 10 of 19: below the request thread, still above anything niced to the bottom (common practice for batch work). */
export const BACKGROUND_NICE = 10;

/** Lowers the calling worker thread's priority (Linux only: elsewhere the value is the whole process's). */
export function runInBackground() {
  if (process.platform !== 'linux') return;
  try {
    os.setPriority(BACKGROUND_NICE);
  } catch {
    // Not allowed here (a sandbox): the work runs at the server's priority, as before.
  }
}
