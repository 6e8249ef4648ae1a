import { GAP_SENSITIVITY_STEP } from '@shared/engine/magnetic-design';
import type { SheetTestLimits, WindingSheet } from './sheet';

// The sheet as labelled lines, shared by the PDF and any plain-text view, so both say the same thing.

/** A value to a few significant figures, without trailing zeros. */
export const significant = (value: number, digits = 4) => Number(value.toPrecision(digits)).toString();
const fmt = significant;
export const microhenry = (h: number) => `${fmt(h * 1e6)} µH`;
export const milliohm = (r: number) => `${fmt(r * 1e3)} mΩ`;
export const millimetre = (m: number, digits = 3) => `${fmt(m * 1e3, digits)} mm`;
export const kilohertz = (hz: number) => `${fmt(hz / 1e3)} kHz`;

/** How much more gap moves L, in words (the engine gives ΔL/L for GAP_SENSITIVITY_STEP more), for the sheet and BOM. */
export const gapSensitivityText = (sensitivity10um: number) =>
  `${Math.round(GAP_SENSITIVITY_STEP * 1e6)} µm more gap lowers L by ${Math.abs(sensitivity10um * 100).toFixed(1)} %`;

/**
 * The keep-out as the shop reads it: the copper's clearance from the gap, which the bobbin tube's wall gives up to its
 * thickness; more is built up with tape on the tube before the first layer.
 */
export const keepOutText = (keepOut: number) =>
  `Keep copper at least ${millimetre(keepOut)} from the gap (centre leg): the bobbin tube's wall counts; build up the rest ` +
  'with tape before the first layer';

export const ohm = (r: number) => (r < 1 ? milliohm(r) : `${fmt(r)} Ω`);

function wireLengthText(w: WindingSheet['parts']['wire']): string {
  const mass = `${fmt(w.mass * 1e3, 3)} g copper in all`;
  const leads = w.leadLength ? ` (winding + 2 leads of ${fmt(w.leadLength * 1e3, 3)} mm)` : ' including leads';
  if (!w.conductorsInHand || w.conductorsInHand === 1 || !w.totalLength) return `${fmt(w.length, 3)} m${leads}; ${mass}`;
  return `${fmt(w.length, 3)} m per wire in hand${leads}; ${w.conductorsInHand} wires = ${fmt(w.totalLength, 3)} m in all; ${mass}`;
}

function inductanceText(t: SheetTestLimits): string {
  const l = t.inductance;
  const base = `${microhenry(l.min)} to ${microhenry(l.max)} (nominal ${microhenry(l.nominal)}) at ${kilohertz(l.testFrequency)}, ${fmt(l.testLevel)} V rms, no DC bias`;
  if (l.reactance === undefined || l.resolution === undefined) return base;
  return `${base}; the reactance there is ${ohm(l.reactance)}: the meter must resolve ${ohm(l.resolution)} (1 % of it)`;
}

function biasText(b: NonNullable<SheetTestLimits['biasInductance']>): string {
  return (
    `at least ${microhenry(b.min)} (${fmt(b.fractionOfNominal * 100, 3)} % of nominal) with ${fmt(b.current, 3)} A DC through the winding ` +
    `(predicted ${microhenry(b.predicted)}); apply the current briefly so the part does not heat`
  );
}

function resistanceText(t: SheetTestLimits): string {
  const base = `at most ${milliohm(t.resistanceMax20)} at 20 °C (correct readings at other temperatures with 0.393 %/K for copper)`;
  const r = t.resistance;
  if (!r) return base;
  const parts = `winding ${milliohm(r.winding)} + leads ${milliohm(r.leads)} + joints ${milliohm(r.terminations)}, +${fmt(r.tolerance * 100)} %`;
  return `${base}, at the pins: ${parts}${r.fourWire ? '; measure four-wire (Kelvin) at the pins' : ''}`;
}

export interface SheetSection {
  title: string;
  lines: [label: string, value: string][];
}

export function sheetSections(s: WindingSheet): SheetSection[] {
  const t = s.tests;
  return [
    {
      title: 'Order',
      lines: [
        ['Design', `${s.header.designNumber} rev ${s.header.revision} — ${s.header.title}`],
        ['Build order', `${s.header.orderNumber}, quantity ${s.header.quantity}`],
        ['Released', s.header.releasedAt.slice(0, 10)],
        ['Author / approver', `${s.header.author} / ${s.header.approver}`],
      ],
    },
    {
      title: 'Parts',
      lines: [
        ['Core', `${s.parts.coreSet}, material ${s.parts.coreMaterial}`],
        ['Gap', s.parts.gap.note],
        ['Bobbin', s.parts.bobbin],
        ['Wire', s.parts.wire.description],
        ['Wire length', wireLengthText(s.parts.wire)],
        ...s.parts.tapes.map((tape, i): [string, string] => [i === 0 ? 'Tapes' : '', tape]),
      ],
    },
    {
      title: 'Winding',
      lines: [
        ['Start', s.winding.startPin],
        ['Finish', s.winding.finishPin],
        [
          'Turns',
          `${s.winding.turns} turns in ${s.winding.layers} layer(s): ${s.winding.turnsPerLayer} per full layer, ${s.winding.lastLayerTurns} on the last`,
        ],
        ['Direction', s.winding.direction],
        ['Traverse', s.winding.traverse],
        ['Interlayer tape', s.winding.interlayerTape],
        ['Margins', s.winding.margins],
        ...(typeof s.winding.keepOut === 'number' ? [['Keep-out', keepOutText(s.winding.keepOut)] as [string, string]] : []),
        ['Outer wrap', s.winding.outerWrap],
      ],
    },
    { title: 'Terminations', lines: s.terminations.map((line): [string, string] => ['', line]) },
    { title: 'Assembly', lines: [...s.assembly.map((line): [string, string] => ['', line]), ['Impregnation', s.impregnation]] },
    {
      title: 'Tests and limits',
      lines: [
        ['Inductance', inductanceText(t)],
        ...(t.biasInductance ? [['L under DC bias', biasText(t.biasInductance)] as [string, string]] : []),
        ['DC resistance', resistanceText(t)],
        ['Hipot', t.hipot.instruction],
      ],
    },
    { title: 'Marking', lines: [['', s.marking]] },
  ];
}
