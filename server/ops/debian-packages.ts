import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';

/** A program we run and the Debian package that installs it. */
export interface DebianTool {
  binary: string;
  pkg: string;
}

/** The packages of the tools whose binaries are missing. */
export const missingPackages = (tools: readonly DebianTool[]): string[] => tools.filter((t) => !existsSync(t.binary)).map((t) => t.pkg);

/** Installs Debian packages as root, non-interactively (apt-get update, then install). */
export function installDebianPackages(packages: readonly string[]): void {
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
  execFileSync('apt-get', ['install', '-y', '-qq', ...packages], { stdio: 'inherit', env });
}
