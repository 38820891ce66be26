// Local disk: write to a temporary name, fsync, then rename, so a crash never leaves half a file under a
// real name (rename within one folder is atomic).
import fs from 'node:fs';
import path from 'node:path';
import crypto from 'node:crypto';
import { pipeline } from 'node:stream/promises';
import type { Readable } from 'node:stream';
import type { ByteRange, ObjectStore, StoredObject } from './index';

const SAFE_KEY = /^[a-z0-9][a-z0-9-]{0,99}$/;
/** A write in progress, or one a crash cut short: listed so that storage:check can clear it. */
const INCOMING = /^\.incoming-[0-9a-f]{16}$/;

export class DiskStore implements ObjectStore {
  constructor(private readonly dir: string) {
    fs.mkdirSync(dir, { recursive: true });
  }

  private file(key: string) {
    // Keys are generated ids; anything else would be a bug, and must never reach the file system.
    if (!SAFE_KEY.test(key) && !INCOMING.test(key)) throw new Error(`invalid storage key ${JSON.stringify(key)}`);
    return path.join(this.dir, key);
  }

  async put(key: string, source: Readable): Promise<void> {
    const final = this.file(key);
    const temp = path.join(this.dir, `.incoming-${crypto.randomBytes(8).toString('hex')}`);
    try {
      const out = fs.createWriteStream(temp, { flags: 'wx' });
      await pipeline(source, out);
      const fd = await fs.promises.open(temp, 'r+');
      try {
        await fd.sync();
      } finally {
        await fd.close();
      }
      await fs.promises.rename(temp, final);
    } catch (err) {
      await fs.promises.rm(temp, { force: true });
      throw err;
    }
  }

  async read(key: string, range?: ByteRange): Promise<Readable> {
    const file = this.file(key);
    await fs.promises.access(file);
    return fs.createReadStream(file, range ? { start: range.start, end: range.end } : {});
  }

  async remove(key: string): Promise<void> {
    await fs.promises.rm(this.file(key), { force: true });
  }

  async exists(key: string): Promise<boolean> {
    return fs.promises.access(this.file(key)).then(
      () => true,
      () => false,
    );
  }

  async *list(): AsyncIterable<StoredObject> {
    for (const entry of await fs.promises.readdir(this.dir, { withFileTypes: true })) {
      if (!entry.isFile() || !(SAFE_KEY.test(entry.name) || INCOMING.test(entry.name))) continue;
      const stat = await fs.promises.stat(path.join(this.dir, entry.name)).catch(() => null);
      if (stat) yield { key: entry.name, sizeBytes: stat.size, modifiedAt: stat.mtime };
    }
  }
}
