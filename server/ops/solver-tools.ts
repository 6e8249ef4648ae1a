import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';

/**
 * The solvers the independent checks run, from Debian's packages: ngspice for the circuit check, gmsh and GetDP for
 * the field check (the same list tests/run.ts installs for the suites).
 */
export const SOLVER_TOOLS: { binary: string; pkg: string }[] = [
  { binary: '/usr/bin/ngspice', pkg: 'ngspice' },
  { binary: '/usr/bin/gmsh', pkg: 'gmsh' },
  { binary: '/usr/bin/getdp', pkg: 'getdp' },
];

/** Installs the missing ones as root (as PostgreSQL is installed); otherwise says how, and checks then fail plainly. */
export function ensureSolverTools(): void {
  const missing = SOLVER_TOOLS.filter((t) => !existsSync(t.binary)).map((t) => t.pkg);
  if (!missing.length) return;
  if (process.getuid?.() !== 0) {
    process.stdout.write(`[solvers] missing: install them with "sudo apt-get install -y ${missing.join(' ')}"; checks fail until then\n`);
    return;
  }
  process.stdout.write(`[solvers] installing Debian packages: ${missing.join(', ')} (about a minute)…\n`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
  execFileSync('apt-get', ['install', '-y', '-qq', ...missing], { stdio: 'inherit', env });
}
