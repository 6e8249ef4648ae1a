import type { Express } from 'express';
import request from 'supertest';
import { DEMO_USERS } from '../../../server/seed/demo-scenario.ts';
import type { Role } from '@shared/schemas/auth';

type Method = 'get' | 'post' | 'patch' | 'put' | 'delete';
/** An app in this process, or the base URL of a server running in its own. */
type Target = Express | string;

/**
 * A browser-like client: keeps the session cookie, and sends the XSRF-TOKEN cookie back as the
 * X-XSRF-TOKEN header on writes, as Angular's HttpClient does.
 */
export class ApiClient {
  readonly agent: ReturnType<typeof request.agent>;
  csrfToken: string | undefined;

  constructor(readonly app: Target) {
    this.agent = request.agent(app);
  }

  private remember(res: request.Response): request.Response {
    const cookies = ([] as string[]).concat(res.headers['set-cookie'] ?? []);
    for (const c of cookies) {
      const m = /^XSRF-TOKEN=([^;]*)/.exec(c);
      if (m) this.csrfToken = decodeURIComponent(m[1]);
    }
    return res;
  }

  async session(): Promise<request.Response> {
    return this.remember(await this.agent.get('/api/auth/session'));
  }

  async send(method: Method, url: string, body?: unknown, { csrf = true } = {}): Promise<request.Response> {
    let req = this.agent[method](url);
    if (csrf && method !== 'get' && this.csrfToken) req = req.set('X-XSRF-TOKEN', this.csrfToken);
    if (body !== undefined) req = req.send(body as object);
    return this.remember(await req);
  }

  get = (url: string) => this.send('get', url);
  post = (url: string, body?: unknown) => this.send('post', url, body);
  patch = (url: string, body?: unknown) => this.send('patch', url, body);
  put = (url: string, body?: unknown) => this.send('put', url, body);
  delete = (url: string) => this.send('delete', url);

  /** A GET whose body is read as bytes (a PDF, say): the answer's `body` is a Buffer. */
  async getBytes(url: string): Promise<request.Response> {
    return this.agent
      .get(url)
      .buffer(true)
      .parse((res, cb) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => cb(null, Buffer.concat(chunks)));
      });
  }

  async signIn(username: string, password: string): Promise<request.Response> {
    if (!this.csrfToken) await this.session();
    return this.post('/api/auth/sign-in', { username, password });
  }
}

export function demoUser(role: Role) {
  const user = DEMO_USERS.find((u) => u.role === role);
  if (!user) throw new Error(`no demo user with role ${role}`);
  return user;
}

export async function signedInAs(app: Target, role: Role | 'anonymous'): Promise<ApiClient> {
  const client = new ApiClient(app);
  await client.session();
  if (role === 'anonymous') return client;
  const user = demoUser(role);
  const res = await client.signIn(user.username, user.password);
  if (res.status !== 200) throw new Error(`sign-in as ${role} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return client;
}
