// Runs external solvers (ngspice, gmsh, GetDP) in a folder of their own with absolute paths, so runs can go in
// parallel, each program under a time limit; a non-zero exit or an error line in its log is a failure with the
// reason in plain words (a gmsh geometry error, for one, does not stop meshing). The folder is removed afterwards.
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

export interface ProgramCall {
  program: string;
  /** Arguments; `{folder}` is replaced by the run's absolute folder. */
  args: string[];
  timeoutMs: number;
  /** Log lines that mean failure even when the program exits 0 (solvers often do). */
  errorLine: RegExp;
}

/** A run's own folder: files the programs wrote, and the programs themselves. */
export interface SolverFolder {
  /** Absolute path. */
  path: string;
  read(name: string): Promise<string>;
  /** Runs one program in the folder; resolves with its log, or rejects with a SolverError saying why. */
  run(call: ProgramCall): Promise<string>;
}

/**
 * Writes the input files (`{folder}` in them replaced by the folder's absolute path) into a fresh folder, hands it to
 * `use`, and removes it afterwards whatever happened.
 */
export async function withSolverFolder<T>(files: Record<string, string>, use: (folder: SolverFolder) => Promise<T>): Promise<T> {
  const folder = await mkdtemp(path.join(tmpdir(), 'gapwright-solver-'));
  const expand = (text: string) => text.replaceAll('{folder}', folder);
  try {
    for (const [name, text] of Object.entries(files)) await writeFile(path.join(folder, name), expand(text));
    return await use({
      path: folder,
      read: (name) => readFile(path.join(folder, name), 'utf8'),
      run: async (call) => {
        const log = await runProgram(call.program, call.args.map(expand), folder, call.timeoutMs);
        const errors = log.split('\n').filter((line) => call.errorLine.test(line));
        if (errors.length) throw new SolverError(`${call.program} reported: ${errors.slice(0, 3).join(' | ')}`, log);
        return log;
      },
    });
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
