// Where the ends of a winding go: its wires in hand over bobbin pins, or a strap or flying leads where the pins
// cannot take them. Pure; the numbers of the trade are in build-practice.ts.
import type { CoreFamily, WireKind } from '../engine/types';
import { bobbinPinCount, LEAD_LENGTH, PIN_COPPER_AREA, PIN_COUNT_SOURCE, PIN_CURRENT, STRAP_THICKNESS } from './build-practice';

export interface TerminationInput {
  family: CoreFamily;
  coreId: string;
  wireKind: WireKind;
  /** Conductors in hand (1 for litz and foil: the bundle or the foil is one conductor). */
  strands: number;
  /** Copper area of one conductor in hand (m²). */
  strandArea: number;
  /** RMS current of the winding (A). */
  rmsCurrent: number;
}

export interface TerminationPlan {
  kind: 'pins' | 'strap' | 'flying-leads' | 'foil-tabs';
  /** The bobbin's pins (estimate; 0 for rings). */
  pinCount: number;
  startPins: number[];
  finishPins: number[];
  /** Conductors wrapped on each pin (the last pin may take fewer). */
  perPin: number;
  /** Strap cross-section (m²) where the ends go to a strap or flying leads; 0 on pins. */
  strapArea: number;
  startText: string;
  finishText: string;
  lines: string[];
}

const mm2 = (m2: number) => `${Number((m2 * 1e6).toPrecision(3))} mm²`;
const range = (from: number, count: number) => Array.from({ length: count }, (_, i) => from + i);
const pinList = (pins: number[]) => (pins.length === 1 ? `pin ${pins[0]}` : `pins ${pins.join(', ')}`);

/** How many pins per end the conductors need, or 0 when pins cannot take them (one conductor too big, too few pins). */
function pinsPerEnd(input: TerminationInput, available: number): number {
  const { strands, strandArea, rmsCurrent } = input;
  if (strandArea > PIN_COPPER_AREA || available < 1) return 0;
  const byArea = Math.ceil((strands * strandArea) / PIN_COPPER_AREA);
  const byCurrent = Math.ceil(rmsCurrent / PIN_CURRENT);
  let pins = Math.max(1, byArea, byCurrent);
  // Whole conductors per pin: spread evenly, more pins until the fullest pin takes no more than its copper.
  while (pins <= strands && Math.ceil(strands / pins) * strandArea > PIN_COPPER_AREA) pins++;
  return pins <= strands && pins <= available ? pins : 0;
}

export function planTerminations(input: TerminationInput): TerminationPlan {
  const { strands, strandArea, rmsCurrent, wireKind } = input;
  const total = strands * strandArea;
  const ring = input.family === 'RING' || input.family === 'POWDER_TOROID';
  const pinCount = bobbinPinCount(input.family, input.coreId);
  const leads = `Leads ${LEAD_LENGTH * 1e3} mm long before termination`;
  const strip =
    wireKind === 'litz'
      ? 'strip the litz ends in a solder pot (or strip the serving) and tin every strand'
      : 'strip the enamel only where soldered (solder-strippable enamel or mechanical stripping)';
  const conductors = strands > 1 ? `the ${strands} wires in hand` : wireKind === 'litz' ? 'the litz bundle' : 'the wire';
  const copper = `${mm2(total)} copper, ${Number(rmsCurrent.toPrecision(3))} A rms`;
  const strapArea = total;
  const strapWidth = Math.ceil((strapArea / STRAP_THICKNESS) * 1e3) / 1e3;

  if (wireKind === 'foil') {
    return {
      kind: 'foil-tabs',
      pinCount,
      startPins: [],
      finishPins: [],
      perPin: 0,
      strapArea,
      startText: ring ? 'Flying lead S (start)' : 'Start tab at the inner foil end, brought out on the pin side',
      finishText: ring ? 'Flying lead F (finish)' : 'Finish tab at the outer foil end, on the pin side',
      lines: [
        `Solder or braze a flat copper lead (tab) of at least ${mm2(strapArea)} across the full width of each foil end; leads ${LEAD_LENGTH * 1e3} mm long`,
        'Deburr the foil edges and insulate each tab joint with tape so it cannot touch the next turn',
        'Bring both leads out on the pin side; no sharp bends',
      ],
    };
  }

  if (ring) {
    return {
      kind: 'flying-leads',
      pinCount: 0,
      startPins: [],
      finishPins: [],
      perPin: 0,
      strapArea,
      startText: 'Flying lead S (start)',
      finishText: 'Flying lead F (finish)',
      lines: [
        `${leads} (flying leads: a ring has no pins); ${strip}`,
        `Twist ${conductors} of each end together (${copper}) and tin the last 5 mm as one lead`,
        'No sharp bends where the leads leave the ring; no enamel or coating damage',
      ],
    };
  }

  const available = Math.floor(pinCount / 2);
  const pins = pinsPerEnd(input, available);
  const pinNote = `the bobbin's ${pinCount} pins are ${PIN_COUNT_SOURCE}; check them against the bobbin used`;
  if (pins === 0) {
    const why =
      strandArea > PIN_COPPER_AREA
        ? `one conductor (${mm2(strandArea)}) is more than a pin takes (about ${mm2(PIN_COPPER_AREA)})`
        : `${conductors} (${copper}) need more than the ${available} pins a side of this bobbin gives (about ${mm2(PIN_COPPER_AREA)} and ${PIN_CURRENT} A a pin)`;
    return {
      kind: 'strap',
      pinCount,
      startPins: [],
      finishPins: [],
      perPin: 0,
      strapArea,
      startText: 'Start lead to a copper strap/bus or flying lead S (not a bobbin pin)',
      finishText: 'Finish lead to a copper strap/bus or flying lead F (not a bobbin pin)',
      lines: [
        `${leads}; ${strip}`,
        `Terminate on a copper strap/bus or flying leads, not on bobbin pins: ${why}. ` +
          `Strap at least ${mm2(strapArea)} in cross-section (e.g. ${STRAP_THICKNESS * 1e3} mm × ${strapWidth * 1e3} mm), ` +
          (strands > 1 ? `${conductors} of each end soldered together into it` : 'each end soldered to it'),
        'No sharp bends at the bobbin exit; no enamel damage',
      ],
    };
  }
  const perPin = Math.ceil(strands / pins);
  const startPins = range(1, pins);
  const finishPins = range(available + 1, pins);
  const split =
    pins === 1
      ? `Wrap ${conductors} of each end together 2–3 turns on its pin and solder (${copper}; a pin takes about ${mm2(PIN_COPPER_AREA)} and ${PIN_CURRENT} A)`
      : `Split ${conductors} over ${pins} pins per end, ${perPin} a pin (the last may take fewer), each group wrapped 2–3 turns and soldered; ` +
        `the board joins the pins of each end (${copper}; a pin takes about ${mm2(PIN_COPPER_AREA)} and ${PIN_CURRENT} A)`;
  return {
    kind: 'pins',
    pinCount,
    startPins,
    finishPins,
    perPin,
    strapArea: 0,
    startText: `Start on ${pinList(startPins)} (at the bobbin tube)`,
    finishText: `Finish on ${pinList(finishPins)} (the other row; finish on the outside)`,
    lines: [`${leads}; ${strip}`, split, `No sharp bends at the bobbin exit; no enamel damage; ${pinNote}`],
  };
}
