import type { WindingSheet } from './sheet';

// The sheet as labelled lines, shared by the PDF and any plain-text view, so both say the same thing.

/** A value to a few significant figures, without trailing zeros. */
export const significant = (value: number, digits = 4) => Number(value.toPrecision(digits)).toString();
const fmt = significant;
export const microhenry = (h: number) => `${fmt(h * 1e6)} µH`;
export const milliohm = (r: number) => `${fmt(r * 1e3)} mΩ`;
export const millimetre = (m: number, digits = 3) => `${fmt(m * 1e3, digits)} mm`;
export const kilohertz = (hz: number) => `${fmt(hz / 1e3)} kHz`;

/**
 * The keep-out as the shop reads it: the copper's clearance from the gap, which the bobbin tube's wall gives up to its
 * thickness; more is built up with tape on the tube before the first layer.
 */
export const keepOutText = (keepOut: number) =>
  `Keep copper at least ${millimetre(keepOut)} from the gap (centre leg): the bobbin tube's wall counts; build up the rest ` +
  'with tape before the first layer';

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
        ['Wire length', `${fmt(s.parts.wire.length, 3)} m including leads (${fmt(s.parts.wire.mass * 1e3, 3)} g copper)`],
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
        [
          'Inductance',
          `${microhenry(t.inductance.min)} to ${microhenry(t.inductance.max)} (nominal ${microhenry(t.inductance.nominal)}) at ${kilohertz(t.inductance.testFrequency)}, ${fmt(t.inductance.testLevel)} V rms, no DC bias`,
        ],
        [
          'DC resistance',
          `at most ${milliohm(t.resistanceMax20)} at 20 °C (correct readings at other temperatures with 0.393 %/K for copper)`,
        ],
        ['Hipot', t.hipot.instruction],
      ],
    },
    { title: 'Marking', lines: [['', s.marking]] },
  ];
}
