// Runs one external solver (ngspice, later gmsh and GetDP) in a folder of its own with absolute paths, so runs can go
// in parallel, under a time limit; a non-zero exit or an error line in its log is a failure with the reason in plain
// words. The folder is removed afterwards unless asked to keep it.
import { spawn } from 'node:child_process';
import { mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';

export class SolverError extends Error {
  constructor(
    message: string,
    readonly log: string,
  ) {
    super(message);
    this.name = 'SolverError';
  }
}

export interface SolverRun {
  /** The run's own folder (absolute). */
  folder: string;
  /** Reads a file the solver wrote in the run's folder. */
  read(name: string): Promise<string>;
  log: string;
}

export interface SolverCall {
  program: string;
  /** Input files by name, written into the run's folder before the program starts; `{folder}` in them as in args. */
  files: Record<string, string>;
  /** Arguments; `{folder}` is replaced by the run's absolute folder. */
  args: string[];
  timeoutMs: number;
  /** Log lines that mean failure even when the program exits 0 (solvers often do). */
  errorLine: RegExp;
}

/** Runs the program, then `use` on its outputs; the folder is removed afterwards. */
export async function withSolverRun<T>(call: SolverCall, use: (run: SolverRun) => Promise<T>): Promise<T> {
  const folder = await mkdtemp(path.join(tmpdir(), `gapwright-${path.basename(call.program)}-`));
  try {
    for (const [name, text] of Object.entries(call.files)) await writeFile(path.join(folder, name), text.replaceAll('{folder}', folder));
    const log = await runProgram(
      call.program,
      call.args.map((a) => a.replaceAll('{folder}', folder)),
      folder,
      call.timeoutMs,
    );
    const errors = log.split('\n').filter((line) => call.errorLine.test(line));
    if (errors.length) throw new SolverError(`${call.program} reported: ${errors.slice(0, 3).join(' | ')}`, log);
    return await use({ folder, log, read: (name) => readFile(path.join(folder, name), 'utf8') });
  } finally {
    await rm(folder, { recursive: true, force: true });
  }
}

function runProgram(program: string, args: string[], cwd: string, timeoutMs: number): Promise<string> {
  return new Promise((resolve, reject) => {
    const child = spawn(program, args, { cwd, stdio: ['ignore', 'pipe', 'pipe'] });
    let log = '';
    child.stdout.on('data', (chunk: Buffer) => (log += chunk.toString('utf8')));
    child.stderr.on('data', (chunk: Buffer) => (log += chunk.toString('utf8')));
    const timer = setTimeout(() => child.kill('SIGKILL'), timeoutMs);
    child.on('error', (error: NodeJS.ErrnoException) => {
      clearTimeout(timer);
      reject(
        new SolverError(
          error.code === 'ENOENT'
            ? `${program} is not installed (Debian package "${program}")`
            : `${program} did not start: ${error.message}`,
          log,
        ),
      );
    });
    child.on('close', (code, signal) => {
      clearTimeout(timer);
      if (signal === 'SIGKILL') reject(new SolverError(`${program} took longer than ${timeoutMs / 1000} s and was stopped`, log));
      else if (code !== 0) reject(new SolverError(`${program} exited with code ${code}: ${lastLines(log)}`, log));
      else resolve(log);
    });
  });
}

const lastLines = (log: string) => log.trim().split('\n').slice(-3).join(' | ');
