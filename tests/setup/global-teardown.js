// After the last test: stop the processes the set-up started, then check that the run left npm start's
// development state exactly as it found it.
const path = require('node:path');
const { root } = require('./processes');
const { devStateFingerprint, firstDifference } = require('./dev-state');

module.exports = async function globalTeardown() {
  for (const child of globalThis.__tactusChildren ?? []) child.kill('SIGTERM');
  const before = JSON.parse(process.env.TACTUS_TEST_DEV_STATE ?? 'null');
  if (!before) return;
  const state = process.env.TACTUS_STATE || path.join(root, '.tactus');
  const after = await devStateFingerprint(state, JSON.parse(process.env.TACTUS_TEST_DB));
  const difference = firstDifference(before, after);
  if (difference) throw new Error(`the tests touched the development state: ${difference}`);
};
