// Starting the project's own processes for tests and benchmarks: a free loopback port, a TypeScript entry
// point run by node with tsx's loader, and waiting for a URL to answer. Plain JavaScript so that jest's
// global set-up (not transformed) can use it too.
const { spawn } = require('node:child_process');
const net = require('node:net');
const path = require('node:path');

const root = path.resolve(__dirname, '../..');

/** @returns {Promise<number>} a TCP port on 127.0.0.1 that was free a moment ago */
const freePort = () =>
  new Promise((resolve, reject) => {
    const s = net.createServer();
    s.listen(0, '127.0.0.1', () => {
      const { port } = /** @type {import('node:net').AddressInfo} */ (s.address());
      s.close(() => resolve(port));
    });
    s.on('error', reject);
  });

/**
 * Waits until `url` answers 2xx.
 * @param {string} url
 * @param {number} ms
 */
async function waitForOk(url, ms) {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    const ok = await fetch(url).then(
      (r) => r.ok,
      () => false,
    );
    if (ok) return;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`${url} did not answer within ${ms} ms`);
}

/**
 * Runs a TypeScript entry point of the project (path from the project root) as `node --import tsx`, not
 * through the tsx command, which would run it in a child of its own and leave that running when killed.
 * @param {string} script
 * @param {NodeJS.ProcessEnv} env
 * @param {import('node:child_process').StdioOptions} [stdio]
 */
const spawnTs = (script, env, stdio = 'ignore') =>
  spawn(process.execPath, ['--import', 'tsx', path.join(root, script)], { env, stdio, cwd: root });

module.exports = { freePort, waitForOk, spawnTs, root };
