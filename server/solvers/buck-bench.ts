// A buck converter test bench for ngspice: the inductor (with its winding resistance) between an ideal switching node
// and an output held at Vout, switched at the duty cycle under test, run from zero current until it has settled. The
// switches are SPICE voltage-controlled switches: with a synchronous rectifier their on-resistances are the spec's,
// with a diode the two drops are constant voltage sources in series (the same constant-drop model of the parts the
// engine assumes, so the bench checks the engine's arithmetic and waveform, not the device models).
import type { ConverterSpec } from '@shared/engine/inputs';
import { SolverError, withSolverFolder } from './solver-run.ts';

export interface BuckBench {
  spec: ConverterSpec;
  vin: number;
  duty: number;
  /** The constant inductance; with a `fluxTable` the zero-current slope, which sets the settling time. */
  inductance: number;
  /** A non-linear inductor instead: its flux linkage at the given currents (see `inductorLines`). */
  fluxTable?: FluxTable;
  /** Inductor current at the start (A); zero unless given. */
  initialCurrent?: number;
  /** Whole periods to simulate; `settlingPeriods` (from zero current to steady state) unless given. */
  periods?: number;
  /** ngspice's relative tolerance (its default 1e-3 unless given). */
  reltol?: number;
  /**
   * The inductor as a SPICE subcircuit instead (an exported model, nodes 1 and 2, its main inductor on a line starting
   * `L1 `; its inductors are given `initialCurrent` as their IC). Its own resistances replace the spec's winding resistance, and
   * the voltage across it is written too, so the power it dissipates can be read.
   */
  subcircuit?: { name: string; text: string };
}

/** Flux linkage Λ (V·s) of a non-linear inductor at rising currents (A); odd-symmetric about zero current. */
export interface FluxTable {
  current: number[];
  fluxLinkage: number[];
}

/** Inductor current over the last switching periods (A): average, highest, lowest, and its change per period. */
export interface SimulatedCurrent {
  average: number;
  peak: number;
  valley: number;
  ripple: number;
  /** Change of the period average from the period before: near zero once settled (A). */
  drift: number;
  /** The last period's solver points: time from the period's switch-on edge (s) and current (A). */
  lastPeriod: { time: number[]; current: number[] };
  /** With a subcircuit inductor: the average of v·i across it over the last period, the power it dissipates (W). */
  dissipation?: number;
}

/** Time steps per switching period the simulation may take at most. */
const STEPS_PER_PERIOD = 400;
/** Settling: this many time constants L/R of the loop from zero current (e^−10 ≈ 5·10⁻⁵ left). */
const TIME_CONSTANTS = 10;
/** Periods written out at the end. */
const PERIODS_KEPT = 2;
/**
 * Drive edges (s). The switches change state where the drive crosses 0.5, mid-edge and between the solver's
 * breakpoints, so the on-time is only as exact as the edge is short: with milliohms in the loop the settled average is
 * (D·Vin − Vout)/R, and 1 ns edges put it 3 % off at 1.2 V out and 0.8 mΩ; 10 ps edges keep it within 0.2 %.
 */
const EDGE = 1e-11;

const num = (x: number) => x.toPrecision(12);

function loopResistance(spec: ConverterSpec, duty: number): number {
  const winding = spec.inductorResistance ?? 0;
  if (spec.rectifier !== 'synchronous') return winding;
  return winding + duty * (spec.highSideResistance ?? 0) + (1 - duty) * (spec.lowSideResistance ?? 0);
}

/** Whole periods from zero current to steady state (at least 20). */
export function settlingPeriods(bench: BuckBench): number {
  const resistance = loopResistance(bench.spec, bench.duty);
  if (!(resistance > 0)) throw new RangeError('The bench needs some loop resistance (winding or switches) to settle.');
  return Math.max(20, Math.ceil((TIME_CONSTANTS * bench.inductance * bench.spec.frequency) / resistance));
}

export function buckBenchNetlist(bench: BuckBench, dataFile: string): string {
  const { spec, vin, duty } = bench;
  const period = 1 / spec.frequency;
  const periods = bench.periods ?? settlingPeriods(bench);
  const synchronous = spec.rectifier === 'synchronous';
  const diode = spec.rectifier === 'diode';
  const onResistance = (r: number | undefined) => num(synchronous ? Math.max(r ?? 0, 1e-6) : 1e-6);
  const width = duty * period - EDGE;
  const windingResistance = bench.subcircuit ? 0 : (spec.inductorResistance ?? 0);
  return [
    '* Gapwright buck test bench (generated)',
    ...(bench.subcircuit ? [withInitialCurrent(bench.subcircuit.text, bench.initialCurrent ?? 0)] : []),
    `Vin in 0 DC ${num(vin)}`,
    'S1 in hs drive 0 high',
    `Vswitch hs sw DC ${num(diode ? (spec.switchDrop ?? 0) : 0)}`,
    'S2 sw ls driveb 0 low',
    `Vfreewheel ls 0 DC ${num(diode ? -(spec.diodeDrop ?? 0) : 0)}`,
    'Vsense sw lx DC 0',
    ...inductorLines(bench),
    `RL ly out ${num(Math.max(windingResistance, 1e-9))}`,
    `Vout out 0 DC ${num(spec.vout)}`,
    `Vdrive drive 0 PULSE(0 1 0 ${EDGE} ${EDGE} ${num(width)} ${num(period)})`,
    `Vdriveb driveb 0 PULSE(1 0 0 ${EDGE} ${EDGE} ${num(width)} ${num(period)})`,
    `.model high SW(Ron=${onResistance(spec.highSideResistance)} Roff=1e7 Vt=0.5 Vh=0)`,
    `.model low SW(Ron=${onResistance(spec.lowSideResistance)} Roff=1e7 Vt=0.5 Vh=0)`,
    ...(bench.reltol ? [`.options reltol=${num(bench.reltol)}`] : []),
    `.tran ${num(period / STEPS_PER_PERIOD)} ${num(periods * period)} ${num((periods - PERIODS_KEPT) * period)} ${num(period / STEPS_PER_PERIOD)} UIC`,
    '.control',
    'set wr_singlescale',
    'set filetype=ascii',
    'run',
    `wrdata ${dataFile} i(Vsense)${bench.subcircuit ? ' v(lx)-v(ly)' : ''}`,
    'quit 0',
    '.endc',
    '.end',
    '',
  ].join('\n');
}

/**
 * The inductor between lx and ly. Constant: a SPICE L. Non-linear: a flux state instead of a SPICE L — a 1 F capacitor
 * charged by a current equal to the inductor voltage holds ∫v dt = Λ (scaled so its node voltage is a few volts, well
 * above the solver's voltage tolerance), and a behavioural current source draws i = Λ⁻¹(Λ) from the table by piecewise
 * linear interpolation (ngspice's pwl() function). So v = dΛ/dt exactly, the incremental inductance dΛ/di follows the
 * table, and the solver never differentiates a table (integrating keeps it stable).
 */
function inductorLines({ inductance, fluxTable, initialCurrent = 0, subcircuit }: BuckBench): string[] {
  if (subcircuit) return [`X1 lx ly ${subcircuit.name}`];
  if (!fluxTable) return [`L1 lx ly ${num(inductance)} IC=${num(initialCurrent)}`];
  const scale = Math.max(...fluxTable.fluxLinkage.map(Math.abs)) / 10;
  const points = fluxTable.current.map((current, k) => `${num(fluxTable.fluxLinkage[k]! / scale)},${num(current)}`);
  return [
    `Gflux 0 phi lx ly ${num(1 / scale)}`,
    `Cflux phi 0 1 IC=${num(interpolate(fluxTable.current, fluxTable.fluxLinkage, initialCurrent) / scale)}`,
    'Rflux phi 0 1e12',
    `Bl lx ly I = pwl(v(phi), ${points.join(', ')})`,
  ];
}

/**
 * The subcircuit with IC=<current> on each of its inductors, so a steady-state run can start where the current already
 * is: every inductor of a series path (the main one and an AC branch's, which carries the DC in steady state) starts at
 * the path's current; an AC branch's resistor would otherwise carry the whole current until its inductor caught up.
 */
function withInitialCurrent(text: string, current: number): string {
  const lines = text.split('\n');
  if (!lines.some((line) => /^L1\s/i.test(line))) throw new RangeError('The subcircuit has no L1 line to start from a given current.');
  return lines.map((line) => (/^L\w*\s/i.test(line) ? `${line.replace(/\s+IC=\S+/i, '')} IC=${num(current)}` : line)).join('\n');
}

/** y(x) by linear interpolation in a rising table (as ngspice's pwl), held at the ends. */
function interpolate(xs: number[], ys: number[], x: number): number {
  if (x <= xs[0]!) return ys[0]!;
  for (let k = 1; k < xs.length; k++) {
    if (x <= xs[k]!) return ys[k - 1]! + ((ys[k]! - ys[k - 1]!) * (x - xs[k - 1]!)) / (xs[k]! - xs[k - 1]!);
  }
  return ys.at(-1)!;
}

/** Trapezoidal average of i(t) over [from, to) from the solver's (non-uniform) time points. */
function averageOver(times: number[], values: number[], from: number, to: number): number {
  let area = 0;
  for (let i = 1; i < times.length; i++) {
    const t0 = Math.max(times[i - 1]!, from);
    const t1 = Math.min(times[i]!, to);
    if (t1 <= t0) continue;
    const at = (t: number) => values[i - 1]! + ((values[i]! - values[i - 1]!) * (t - times[i - 1]!)) / (times[i]! - times[i - 1]!);
    area += ((at(t0) + at(t1)) / 2) * (t1 - t0);
  }
  return area / (to - from);
}

export function readSimulatedCurrent(data: string, frequency: number): SimulatedCurrent {
  const times: number[] = [];
  const values: number[] = [];
  const power: number[] = [];
  for (const line of data.split('\n')) {
    const cells = line.trim().split(/\s+/).map(Number);
    if (cells.length >= 2 && cells.every(Number.isFinite)) {
      times.push(cells[0]!);
      values.push(cells[1]!);
      if (cells.length >= 3) power.push(cells[1]! * cells[2]!);
    }
  }
  if (times.length < 10) throw new SolverError('ngspice wrote too few points of the inductor current', data.slice(0, 500));
  const end = times.at(-1)!;
  const period = 1 / frequency;
  const last = times.map((t, i) => (t >= end - period ? values[i]! : Number.NaN)).filter(Number.isFinite);
  const average = averageOver(times, values, end - period, end);
  const before = averageOver(times, values, end - 2 * period, end - period);
  const peak = Math.max(...last);
  const valley = Math.min(...last);
  const start = end - period;
  const lastPeriod = { time: [] as number[], current: [] as number[] };
  times.forEach((t, i) => {
    if (t < start) return;
    lastPeriod.time.push(t - start);
    lastPeriod.current.push(values[i]!);
  });
  const dissipation = power.length === times.length ? averageOver(times, power, end - period, end) : undefined;
  return {
    average,
    peak,
    valley,
    ripple: peak - valley,
    drift: average - before,
    lastPeriod,
    ...(dissipation === undefined ? {} : { dissipation }),
  };
}

/** Runs the bench in ngspice (its .control block, no terminal) and reads the inductor current of the last period. */
export async function simulateBuck(bench: BuckBench, timeoutMs = 60_000): Promise<SimulatedCurrent> {
  return withSolverFolder({ 'bench.cir': buckBenchNetlist(bench, '{folder}/current.txt') }, async (folder) => {
    // Interactive mode reading the file's .control block (batch mode would also want .print lines), ended by quit.
    await folder.run({ program: 'ngspice', args: ['{folder}/bench.cir'], timeoutMs, errorLine: /^\s*(error|fatal)\b/i });
    return readSimulatedCurrent(await folder.read('current.txt'), bench.spec.frequency);
  });
}

/** Periods of one shooting run, and the largest mismatch i(end) − i(start) accepted as periodic (A per A of load). */
const SHOOTING_PERIODS = 4;
const SHOOTING_TOLERANCE = 1e-6;
const SHOOTING_STEPS = 8;
/**
 * The map's slope is only r^4 − 1 ≈ −4·R·T/L (a few thousandths at milliohms), so an error ε in the end current
 * moves the fixed point by ε/(4·R·T/L): the runs integrate with a relative tolerance of 1e-6, not ngspice's 1e-3.
 */
const SHOOTING_RELTOL = 1e-6;

/**
 * The periodic steady state by the shooting method (Aprille and Trick, "Steady-state analysis of nonlinear circuits
 * with periodic inputs", Proc. IEEE 60(1), 1972 — from memory): the bench has one state, the inductor current, so the
 * steady state is the starting current x whose current after a few periods is x again, found by secant steps from a
 * guess (a few short runs instead of the L/R settling from zero, which takes thousands of periods when the loop
 * resistance is milliohms). The last run's final period is the answer; its drift is then ~0 by construction.
 */
export async function simulateBuckSteady(bench: BuckBench, guess: number, timeoutMs = 60_000): Promise<SimulatedCurrent> {
  const scale = Math.max(Math.abs(guess), 1e-3);
  const run = async (x: number) => {
    const simulated = await simulateBuck({ ...bench, initialCurrent: x, periods: SHOOTING_PERIODS, reltol: SHOOTING_RELTOL }, timeoutMs);
    return { x, simulated, mismatch: simulated.lastPeriod.current.at(-1)! - x };
  };
  let previous = await run(guess);
  if (Math.abs(previous.mismatch) < SHOOTING_TOLERANCE * scale) return previous.simulated;
  let current = await run(guess + 0.01 * scale);
  for (let step = 0; step < SHOOTING_STEPS; step++) {
    if (Math.abs(current.mismatch) < SHOOTING_TOLERANCE * scale) return current.simulated;
    const slope = (current.mismatch - previous.mismatch) / (current.x - previous.x);
    if (!(slope < 0)) break;
    [previous, current] = [current, await run(current.x - current.mismatch / slope)];
  }
  if (Math.abs(current.mismatch) < SHOOTING_TOLERANCE * scale) return current.simulated;
  throw new SolverError(`the bench did not reach a periodic steady state (mismatch ${current.mismatch.toPrecision(3)} A)`, '');
}
