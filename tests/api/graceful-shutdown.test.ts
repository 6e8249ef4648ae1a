import type { ChildProcess } from 'node:child_process';
import http from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_USERS } from '../../server/seed/demo-scenario.ts';
import { startServerProcess, type ServerProcess } from '../support/server-process.ts';
import { resetTestDatabase, testDatabaseUrl } from './support/test-app.ts';

// The real entry file in its own process: SIGTERM must let an in-flight request finish, refuse new
// connections, and exit 0.

interface Reply {
  status: number;
  headers: http.IncomingHttpHeaders;
  body: string;
}

function request(port: number, method: string, urlPath: string, headers: Record<string, string> = {}, body?: string): Promise<Reply> {
  return new Promise((resolve, reject) => {
    const req = http.request({ host: '127.0.0.1', port, method, path: urlPath, headers }, (res) => {
      let text = '';
      res.on('data', (c: Buffer) => (text += c.toString()));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: text }));
    });
    req.on('error', reject);
    req.end(body);
  });
}

let server: ServerProcess;
let child: ChildProcess;
let port: number;
let exit: Promise<number | null>;

beforeAll(async () => {
  // Other files change demo passwords in this shared database: start from the seeded state like every file.
  await resetTestDatabase();
  server = await startServerProcess(testDatabaseUrl());
  ({ child, port, exited: exit } = server);
}, 60_000);

afterAll(() => {
  if (child.exitCode === null) child.kill('SIGKILL');
});

describe('SIGTERM during a slow request', () => {
  it('finishes the request, refuses new connections and exits 0', async () => {
    const session = await request(port, 'GET', '/api/auth/session');
    const cookies = ([] as string[]).concat(session.headers['set-cookie'] ?? []).map((c) => c.split(';')[0]);
    const token = decodeURIComponent(cookies.find((c) => c.startsWith('XSRF-TOKEN='))!.split('=')[1]);
    const user = DEMO_USERS.find((u) => u.role === 'engineer')!;
    const body = JSON.stringify({ username: user.username, password: user.password });

    // A sign-in whose body arrives slowly: the request is in flight when the signal comes, and its
    // body is finished only once the server has stopped accepting new connections.
    let finishBody: () => void = () => {};
    const slow = new Promise<Reply>((resolve, reject) => {
      const req = http.request(
        {
          host: '127.0.0.1',
          port,
          method: 'POST',
          path: '/api/auth/sign-in',
          headers: {
            'Content-Type': 'application/json',
            'Content-Length': String(Buffer.byteLength(body)),
            Cookie: cookies.join('; '),
            'X-XSRF-TOKEN': token,
          },
        },
        (res) => {
          let text = '';
          res.on('data', (c: Buffer) => (text += c.toString()));
          res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: text }));
        },
      );
      req.on('error', reject);
      req.write(body.slice(0, 10));
      finishBody = () => req.end(body.slice(10));
    });

    await new Promise((r) => setTimeout(r, 200));
    child.kill('SIGTERM');
    let refused = false;
    for (let i = 0; i < 100 && !refused; i++) {
      refused = await request(port, 'GET', '/api/health').then(
        () => false,
        (err: NodeJS.ErrnoException) => err.code === 'ECONNREFUSED',
      );
      if (!refused) await new Promise((r) => setTimeout(r, 100));
    }
    expect(refused).toBe(true);
    expect(child.exitCode).toBeNull(); // still draining the slow request
    finishBody();

    const reply = await slow;
    expect(reply.status).toBe(200);
    expect(JSON.parse(reply.body).user.username).toBe(user.username);
    expect(await exit).toBe(0);
  });
});
