import { installDebianPackages, missingPackages, type DebianTool } from './debian-packages.ts';

/**
 * The solvers the independent checks run, from Debian's packages: ngspice for the circuit check, gmsh and GetDP for
 * the field check (the same list tests/run.ts installs for the suites).
 */
export const SOLVER_TOOLS: DebianTool[] = [
  { binary: '/usr/bin/ngspice', pkg: 'ngspice' },
  { binary: '/usr/bin/gmsh', pkg: 'gmsh' },
  { binary: '/usr/bin/getdp', pkg: 'getdp' },
];

/** Installs the missing ones as root (as PostgreSQL is installed); otherwise says how, and checks then fail plainly. */
export function ensureSolverTools(): void {
  const missing = missingPackages(SOLVER_TOOLS);
  if (!missing.length) return;
  if (process.getuid?.() !== 0) {
    process.stdout.write(`[solvers] missing: install them with "sudo apt-get install -y ${missing.join(' ')}"; checks fail until then\n`);
    return;
  }
  process.stdout.write(`[solvers] installing Debian packages: ${missing.join(', ')} (about a minute)…\n`);
  installDebianPackages(missing);
}
