// The disk store's two ways in: `put` streams a source in, `adopt` takes an upload's spool file, renaming it
// where spool and store share a file system and copying it where they do not (EXDEV). Either way the object
// appears whole under its key or not at all, and no temporary file is left behind.
import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { DiskStore } from '@/server/storage/disk';

const made: string[] = [];
const folder = (base = os.tmpdir()) => {
  const dir = fs.mkdtempSync(path.join(base, 'tactus-disk-store-'));
  made.push(dir);
  return dir;
};
afterAll(() => made.forEach((d) => fs.rmSync(d, { recursive: true, force: true })));

const bytesOf = async (store: DiskStore, key: string) => {
  const chunks: Buffer[] = [];
  for await (const c of await store.read(key)) chunks.push(c as Buffer);
  return Buffer.concat(chunks);
};
const leftovers = (dir: string) => fs.readdirSync(dir).filter((n) => n.startsWith('.incoming-'));

test('a spool file on the same file system is moved in, not copied: same bytes, same inode, gone from the spool', async () => {
  const base = folder();
  const spool = path.join(base, 'spool');
  fs.mkdirSync(spool);
  const store = new DiskStore(path.join(base, 'store'));
  const file = path.join(spool, 'upload-1');
  const content = crypto.randomBytes(300_000);
  fs.writeFileSync(file, content);
  const inode = fs.statSync(file).ino;
  await store.adopt('recording-1', file);
  expect(fs.existsSync(file)).toBe(false);
  expect(fs.statSync(path.join(base, 'store', 'recording-1')).ino).toBe(inode);
  expect((await bytesOf(store, 'recording-1')).equals(content)).toBe(true);
  expect(leftovers(path.join(base, 'store'))).toEqual([]);
});

// /dev/shm is a tmpfs on Linux, so a rename from it into a folder under the temporary directory fails with EXDEV.
const otherDevice = fs.existsSync('/dev/shm') && fs.statSync('/dev/shm').dev !== fs.statSync(os.tmpdir()).dev;
(otherDevice ? test : test.skip)('a spool file on another file system is copied in whole', async () => {
  const dir = path.join(folder(), 'store');
  const store = new DiskStore(dir);
  const file = path.join(folder('/dev/shm'), 'upload-2');
  const content = crypto.randomBytes(200_000);
  fs.writeFileSync(file, content);
  await store.adopt('recording-2', file);
  expect((await bytesOf(store, 'recording-2')).equals(content)).toBe(true);
  expect(leftovers(dir)).toEqual([]);
});

test('a spool file that is not there: refused, nothing stored under the key, nothing left over', async () => {
  const dir = path.join(folder(), 'store');
  const store = new DiskStore(dir);
  await expect(store.adopt('recording-3', path.join(dir, '..', 'no-such-upload'))).rejects.toMatchObject({
    code: 'ENOENT',
  });
  expect(await store.exists('recording-3')).toBe(false);
  expect(leftovers(dir)).toEqual([]);
});
