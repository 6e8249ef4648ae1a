import { spawn, type ChildProcess } from 'node:child_process';
import net from 'node:net';
import { fileURLToPath } from 'node:url';

const repoRoot = fileURLToPath(new URL('../..', import.meta.url));

export interface ServerProcess {
  child: ChildProcess;
  port: number;
  baseUrl: string;
  /** The exit code once the process has ended and its stderr is read to the end. */
  exited: Promise<number | null>;
  /** The last few kilobytes the process wrote to stderr (why it died, when it did). */
  stderrTail: () => string;
}

/** A port nobody is listening on right now, on loopback. */
export function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const s = net.createServer().listen(0, '127.0.0.1', () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}

/**
 * The real entry file (`server/main.ts`) in a process of its own on a free loopback port, resolved once
 * `/api/health` answers 200. Used where the test or benchmark needs signals, a separate event loop or RSS.
 */
export async function startServerProcess(databaseUrl: string, env: Record<string, string> = {}): Promise<ServerProcess> {
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
    cwd: repoRoot,
    env: {
      ...process.env,
      NODE_ENV: 'test',
      PORT: String(port),
      DATABASE_URL: databaseUrl,
      SESSION_SECRET: 'server-process-secret-that-is-long-enough-0123456789',
      LOG_LEVEL: 'silent',
      FAKE_SMTP_PORT: '0',
      STATIC_DIR: `${repoRoot}dist/gapwright/browser`,
      ...env,
    },
    stdio: ['ignore', 'ignore', 'pipe'],
  });
  let stderr = '';
  child.stderr!.on('data', (chunk: Buffer) => (stderr = (stderr + chunk.toString()).slice(-4000)));
  const stderrTail = () => stderr;
  const exited = new Promise<number | null>((resolve) => child.once('close', (code) => resolve(code)));
  for (let i = 0; i < 200; i++) {
    if (
      await fetch(`${baseUrl}/api/health`).then(
        (r) => r.ok,
        () => false,
      )
    )
      return { child, port, baseUrl, exited, stderrTail };
    if (child.exitCode !== null) break;
    await new Promise((r) => setTimeout(r, 200));
  }
  const code = child.exitCode;
  child.kill('SIGKILL');
  throw new Error(
    `the server process did not come up (${code === null ? 'no answer within 40 s' : `exited with ${code}`}); its stderr ended: ${stderrTail() || '(nothing)'}`,
  );
}
