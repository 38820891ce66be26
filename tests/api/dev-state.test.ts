// Tests use their own database, storage folder and mail folder: npm start's development state is exactly as
// it was before the run (the global teardown checks the same after the last test).
import path from 'node:path';
// eslint-disable-next-line @typescript-eslint/no-require-imports
const { devStateFingerprint, firstDifference } = require('../setup/dev-state');

const root = path.resolve(__dirname, '../..');
const state = process.env.TACTUS_STATE || path.join(root, '.tactus');

test('the development state is as it was before the test run started', async () => {
  const before = JSON.parse(process.env.TACTUS_TEST_DEV_STATE!);
  const now = await devStateFingerprint(state, JSON.parse(process.env.TACTUS_TEST_DB!));
  expect(firstDifference(before, now)).toBeNull();
});
