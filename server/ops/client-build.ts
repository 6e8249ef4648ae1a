import { execFileSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';

const CLIENT_INPUTS = ['src', 'shared', 'public', 'angular.json', 'tsconfig.json', 'tsconfig.app.json', 'package-lock.json'];

function newestMtime(entry: string): number {
  if (!existsSync(entry)) return 0;
  const stat = statSync(entry);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const child of readdirSync(entry)) newest = Math.max(newest, newestMtime(path.join(entry, child)));
  return newest;
}

/** Builds the Angular app when the build is missing or older than any of its inputs. */
export function ensureClientBuild(repoRoot: string, outputIndex: string): void {
  const index = path.join(repoRoot, outputIndex);
  const built = existsSync(index) ? statSync(index).mtimeMs : 0;
  const inputs = Math.max(...CLIENT_INPUTS.map((p) => newestMtime(path.join(repoRoot, p))));
  if (built > inputs) {
    process.stdout.write('[build] web app is up to date\n');
    return;
  }
  process.stdout.write('[build] building the web app (about 20 s)…\n');
  execFileSync(process.execPath, [path.join(repoRoot, 'node_modules/@angular/cli/bin/ng.js'), 'build'], {
    cwd: repoRoot,
    stdio: 'inherit',
    env: { ...process.env, NG_CLI_ANALYTICS: 'false' },
  });
}
