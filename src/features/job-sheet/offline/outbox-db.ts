import { openDB, type DBSchema, type IDBPDatabase } from 'idb';

/** One change made on the job sheet, waiting to reach the server. Its `key` is the Idempotency-Key. */
export type OutboxItem = {
  key: string;
  jobId: string;
  kind: 'tick' | 'note' | 'photo' | 'finish';
  /** POST target, e.g. /api/jobs/<id>/ticks. */
  url: string;
  /** JSON body (ticks, notes) or the photo's text fields. */
  body: Record<string, unknown>;
  /** The photo itself, kept in IndexedDB until it is sent. */
  file?: Blob;
  fileName?: string;
  createdAt: string;
  /** 'failed' when the server refused it (4xx): shown with its message, never retried by itself. */
  status: 'waiting' | 'failed';
  error?: string;
};

interface OutboxSchema extends DBSchema {
  outbox: { key: string; value: OutboxItem; indexes: { 'by-job': string } };
}

const DB_NAME = 'quiltline-offline';
let dbPromise: Promise<IDBPDatabase<OutboxSchema>> | null = null;

function db() {
  dbPromise ??= openDB<OutboxSchema>(DB_NAME, 1, {
    upgrade(d) {
      const store = d.createObjectStore('outbox', { keyPath: 'key' });
      store.createIndex('by-job', 'jobId');
    },
  });
  return dbPromise;
}

export async function putItem(item: OutboxItem): Promise<void> {
  await (await db()).put('outbox', item);
}

export async function deleteItem(key: string): Promise<void> {
  await (await db()).delete('outbox', key);
}

/** Every item, oldest first (the order they were made in is the order they are sent in). */
export async function allItems(): Promise<OutboxItem[]> {
  const items = await (await db()).getAll('outbox');
  return items.sort((a, b) => a.createdAt.localeCompare(b.createdAt) || a.key.localeCompare(b.key));
}

/** A fresh idempotency key (random, URL-safe). */
export function newKey(): string {
  return crypto.randomUUID();
}
