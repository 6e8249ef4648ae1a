import { expect } from 'vitest';
import type { Db } from '../../../server/db/client.ts';
import type { ApiClient } from './api-client.ts';
import { tableCount } from './test-app.ts';

/** POST a CSV file as the browser does (multipart field "file", decisions as JSON in "decisions"). */
export function uploadCsv(
  client: ApiClient,
  url: string,
  content: Buffer | string,
  fileName: string,
  decisions?: Record<string, string> | string,
) {
  let req = client.agent.post(url).set('X-XSRF-TOKEN', client.csrfToken ?? '');
  if (decisions !== undefined) req = req.field('decisions', typeof decisions === 'string' ? decisions : JSON.stringify(decisions));
  return req.attach('file', Buffer.isBuffer(content) ? content : Buffer.from(content, 'utf8'), {
    filename: fileName,
    contentType: 'text/csv',
  });
}

export async function tableCounts(db: Db, tables: readonly string[]): Promise<Record<string, number>> {
  const entries = await Promise.all(tables.map(async (name) => [name, await tableCount(db, name)] as const));
  return Object.fromEntries(entries);
}

function fieldMatching(fields: Record<string, string> | undefined, key: RegExp): string | undefined {
  return Object.entries(fields ?? {}).find(([k]) => key.test(k))?.[1];
}

/**
 * A broken file sent to `<importUrl>/commit` and `<importUrl>/preview`: the commit is refused (4xx) with the
 * field `key` ("file", "header.x" or "row N.column") saying `message`; the preview either lists the same
 * problem on that row and column (a readable file) or is refused the same way.
 */
export async function expectRefusedFile(
  client: ApiClient,
  importUrl: string,
  content: Buffer,
  fileName: string,
  key: RegExp,
  message: RegExp,
): Promise<void> {
  const commit = await uploadCsv(client, `${importUrl}/commit`, content, fileName, {});
  expect(commit.status).toBeGreaterThanOrEqual(400);
  expect(commit.status).toBeLessThan(500);
  expect(fieldMatching(commit.body.error.fields, key)).toMatch(message);

  const preview = await uploadCsv(client, `${importUrl}/preview`, content, fileName);
  if (preview.status === 200) {
    const [, row, column] = /^row (\d+)\.(.+)$/.exec(key.source.replace(/[\^$\\]/g, '')) ?? [];
    const listed = preview.body.rows.find((r: { row: number }) => r.row === Number(row));
    expect(listed.status).toBe('error');
    expect(listed.problems.find((p: { column: string }) => p.column === column).message).toMatch(message);
  } else {
    expect(preview.status).toBeGreaterThanOrEqual(400);
    expect(preview.status).toBeLessThan(500);
    expect(fieldMatching(preview.body.error.fields, key)).toMatch(message);
  }
}
