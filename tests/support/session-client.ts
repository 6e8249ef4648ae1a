// A signed-in browser stand-in over fetch for tests that talk to a server in another process: it keeps the
// session cookies and sends the XSRF-TOKEN cookie back as X-XSRF-TOKEN on writes, as Angular does.

export interface Answer {
  /** The HTTP status, or 0 when no answer came (connection refused or reset). */
  status: number;
  text: string;
  /** The first duration (ms) of the answer's Server-Timing header, where the route sends one. */
  serverTiming?: number;
}

export class SessionClient {
  private constructor(
    private readonly baseUrl: string,
    private readonly cookies: Map<string, string>,
  ) {}

  static async signIn(baseUrl: string, username: string, password: string): Promise<SessionClient> {
    const client = new SessionClient(baseUrl, new Map());
    await client.expectOk('GET', '/api/auth/session');
    await client.expectOk('POST', '/api/auth/sign-in', { username, password });
    return client;
  }

  /** The same session, talking to a server on another address (the session lives in the database). */
  at(baseUrl: string): SessionClient {
    return new SessionClient(baseUrl, this.cookies);
  }

  /** The session's request headers, also for load tools that send requests of their own (autocannon). */
  headers(method: string, withJsonBody: boolean): Record<string, string> {
    const headers: Record<string, string> = { cookie: [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ') };
    if (method !== 'GET') headers['x-xsrf-token'] = decodeURIComponent(this.cookies.get('XSRF-TOKEN') ?? '');
    if (withJsonBody) headers['content-type'] = 'application/json';
    return headers;
  }

  async send(method: string, path: string, body?: unknown): Promise<Answer> {
    const headers = this.headers(method, body !== undefined);
    try {
      const res = await fetch(`${this.baseUrl}${path}`, { method, headers, body: body === undefined ? undefined : JSON.stringify(body) });
      for (const cookie of res.headers.getSetCookie()) {
        const [pair] = cookie.split(';');
        const at = pair.indexOf('=');
        this.cookies.set(pair.slice(0, at), pair.slice(at + 1));
      }
      const timing = /dur=([\d.]+)/.exec(res.headers.get('server-timing') ?? '');
      return { status: res.status, text: await res.text(), ...(timing ? { serverTiming: Number(timing[1]) } : {}) };
    } catch (err) {
      return { status: 0, text: String((err as Error).cause ?? err) };
    }
  }

  /** The parsed body of a 2xx answer; anything else throws with what came back. */
  async expectOk(method: string, path: string, body?: unknown): Promise<unknown> {
    const answer = await this.send(method, path, body);
    if (answer.status < 200 || answer.status > 299)
      throw new Error(`${method} ${path} answered ${answer.status}: ${answer.text.slice(0, 300)}`);
    return answer.text ? JSON.parse(answer.text) : undefined;
  }
}
