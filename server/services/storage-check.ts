// Stored objects against recording rows, on either storage driver: objects no row names (an upload cut off
// between the file and its row, a delete that removed the rows but not the file) and rows whose object is
// gone. With `fix`, orphaned objects older than `olderThanMs` are removed: younger ones may belong to an
// upload whose row is about to be written. Rows are never touched; a missing object is for a person to judge.
import { Recording } from '@/server/models';
import { objectStore, type StoredObject } from '@/server/storage';

export interface StorageReport {
  objects: number;
  rows: number;
  orphanObjects: (StoredObject & { removed: boolean })[];
  missingObjects: { recordingId: string; storageKey: string }[];
}

export async function checkStorage(opts: { fix: boolean; olderThanMs: number; now?: number }): Promise<StorageReport> {
  const now = opts.now ?? Date.now();
  // Rows first: an upload that completes between the two reads then shows as an orphan too young to remove,
  // never as a row without its object.
  const rows = await Recording.findAll({ attributes: ['id', 'storageKey'], raw: true });
  const store = objectStore();
  const listed: StoredObject[] = [];
  for await (const o of store.list()) listed.push(o);
  const rowKeys = new Set(rows.map((r) => r.storageKey));
  const objectKeys = new Set(listed.map((o) => o.key));
  const orphanObjects: StorageReport['orphanObjects'] = [];
  for (const o of listed) {
    if (rowKeys.has(o.key)) continue;
    const old = now - o.modifiedAt.getTime() > opts.olderThanMs;
    // Looked up once more just before removing: the row may have been written since the listing.
    const removable = opts.fix && old && !(await Recording.count({ where: { storageKey: o.key } }));
    if (removable) await store.remove(o.key);
    orphanObjects.push({ ...o, removed: removable });
  }
  const missingObjects = rows
    .filter((r) => !objectKeys.has(r.storageKey))
    .map((r) => ({ recordingId: r.id, storageKey: r.storageKey }));
  return { objects: listed.length, rows: rows.length, orphanObjects, missingObjects };
}
