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
    const temp = this.tempFile();
    try {
      await pipeline(source, fs.createWriteStream(temp, { flags: 'wx' }));
      await this.commit(temp, key);
    } catch (err) {
      await fs.promises.rm(temp, { force: true });
      throw err;
    }
  }

  /**
   * A spool file on the same file system is renamed in rather than copied: a 100 MB upload used to be read
   * and written again in 64 KB pieces through the event loop (ten at once held /api/health up and raised the
   * server's memory). Across file systems (EXDEV) it is copied as `put` does.
   */
  async adopt(key: string, file: string): Promise<void> {
    const temp = this.tempFile();
    try {
      await fs.promises.rename(file, temp);
    } catch (err) {
      if ((err as { code?: string }).code !== 'EXDEV') throw err;
      return this.put(key, fs.createReadStream(file));
    }
    try {
      await this.commit(temp, key);
    } catch (err) {
      await fs.promises.rm(temp, { force: true });
      throw err;
    }
  }

  private tempFile() {
    return path.join(this.dir, `.incoming-${crypto.randomBytes(8).toString('hex')}`);
  }

  /** The bytes on the disk (fsync) before the file takes its real name. */
  private async commit(temp: string, key: string) {
    const final = this.file(key);
    const fd = await fs.promises.open(temp, 'r+');
    try {
      await fd.sync();
    } finally {
      await fd.close();
    }
    await fs.promises.rename(temp, final);
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
