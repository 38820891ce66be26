// Where recordings' files live: one small interface, two drivers (local disk, S3-compatible object storage).
import type { Readable } from 'node:stream';
import { config } from '@/server/config';
import { DiskStore } from './disk';
import { S3Store } from './s3';

export interface ByteRange {
  start: number;
  /** Inclusive. */
  end: number;
}

/** One stored object as a listing shows it. */
export interface StoredObject {
  key: string;
  sizeBytes: number;
  modifiedAt: Date;
}

export interface ObjectStore {
  /** Streams `source` in under `key`; a failure part-way leaves nothing under that key. */
  put(key: string, source: Readable, contentType: string): Promise<void>;
  /**
   * Takes the file at `file` (a spool file, the caller's to give away) in under `key`, with the same promise
   * as `put`. The disk store renames it where it can instead of copying it; the file may be gone afterwards.
   */
  adopt(key: string, file: string, contentType: string): Promise<void>;
  read(key: string, range?: ByteRange): Promise<Readable>;
  remove(key: string): Promise<void>;
  exists(key: string): Promise<boolean>;
  /** Every object, including what a write cut short left behind (for storage:check). */
  list(): AsyncIterable<StoredObject>;
}

let store: ObjectStore | null = null;

export function objectStore(): ObjectStore {
  if (!store)
    store = config.storage.driver === 's3' ? new S3Store(config.storage.s3) : new DiskStore(config.storage.dir);
  return store;
}
