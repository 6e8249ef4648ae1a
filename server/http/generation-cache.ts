import { createHash } from 'node:crypto';

interface Entry {
  generation: string;
  body: string;
  etag: string;
}

/** A JSON answer ready to send: its text and its ETag. */
export type CachedAnswer = Omit<Entry, 'generation'>;

/**
 * Answers kept while the data they come from is unchanged: each entry remembers the change counter it was built
 * under (read from the database in the request's session query, see server/auth/session-store.ts) and is rebuilt
 * as soon as a request sees another value. Without a counter (not read) nothing is cached.
 */
export class GenerationCache {
  private readonly entries = new Map<string, Entry>();

  async answer(key: string, generation: string | undefined, build: () => Promise<unknown>): Promise<CachedAnswer> {
    const hit = generation === undefined ? undefined : this.entries.get(key);
    if (hit && hit.generation === generation) return hit;
    const body = JSON.stringify(await build());
    const entry = { generation: generation ?? '', body, etag: `W/"${createHash('sha1').update(body).digest('base64url')}"` };
    if (generation !== undefined) this.entries.set(key, entry);
    return entry;
  }
}

/**
 * Values kept per key while the change counter they were built under stands still, like GenerationCache but for
 * answers that vary with their query: at most `limit` keys, the oldest dropped first. Without a counter nothing is
 * cached.
 */
export class GenerationMemo<T> {
  private readonly entries = new Map<string, { generation: string; value: T }>();

  constructor(private readonly limit = 200) {}

  async get(key: string, generation: string | undefined, build: () => Promise<T>): Promise<T> {
    if (generation === undefined) return build();
    const hit = this.entries.get(key);
    if (hit && hit.generation === generation) return hit.value;
    const value = await build();
    this.entries.delete(key);
    this.entries.set(key, { generation, value });
    if (this.entries.size > this.limit) this.entries.delete(this.entries.keys().next().value!);
    return value;
  }
}
