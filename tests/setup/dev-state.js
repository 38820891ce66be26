// A fingerprint of the development state that npm start uses (its recordings folder, caught mail, upload spool
// and the tactus_dev database). The test run takes one before the first test and compares after the last:
// tests only ever touch their own database, folders and mail.
const fs = require('node:fs');
const path = require('node:path');
const mariadb = require('mariadb');

const DEV_FOLDERS = ['recordings', 'mail', 'spool'];
const DEV_DATABASE = 'tactus_dev';

function listFiles(dir, base = dir) {
  if (!fs.existsSync(dir)) return [];
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const full = path.join(dir, e.name);
    if (e.isDirectory()) return listFiles(full, base);
    const st = fs.statSync(full);
    return [`${path.relative(base, full)} ${st.size} ${st.mtimeMs}`];
  });
}

/** @returns {Promise<Record<string, string[]>>} files per development folder, and a checksum per table */
async function devStateFingerprint(state, db) {
  const print = {};
  for (const folder of DEV_FOLDERS) print[folder] = listFiles(path.join(state, folder)).sort();
  const conn = await mariadb.createConnection(db);
  try {
    const exists = await conn.query('SELECT 1 FROM information_schema.schemata WHERE schema_name = ?', [DEV_DATABASE]);
    if (!exists.length) print[DEV_DATABASE] = ['absent'];
    else {
      const tables = await conn.query(
        'SELECT table_name AS t FROM information_schema.tables WHERE table_schema = ? ORDER BY 1',
        [DEV_DATABASE],
      );
      const sums = tables.length
        ? await conn.query(`CHECKSUM TABLE ${tables.map((r) => `${DEV_DATABASE}.\`${r.t}\``).join(', ')} EXTENDED`)
        : [];
      print[DEV_DATABASE] = sums.map((r) => `${r.Table} ${r.Checksum}`);
    }
  } finally {
    await conn.end();
  }
  return print;
}

/** The first difference between two fingerprints, in words, or null. */
function firstDifference(before, after) {
  for (const key of Object.keys({ ...before, ...after })) {
    const a = JSON.stringify(before[key] ?? []);
    const b = JSON.stringify(after[key] ?? []);
    if (a !== b) return `${key} changed during the test run: before ${a.slice(0, 300)}, after ${b.slice(0, 300)}`;
  }
  return null;
}

module.exports = { devStateFingerprint, firstDifference, DEV_DATABASE };
