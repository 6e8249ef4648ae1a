// Copper foil (and, from 0.8 mm, strip or strap) for few-turn, high-current windings: one turn per layer across the winding width, with
// interlayer film between turns. The thicknesses are the usual stock of a winding shop (common practice, no
// source); the film is two layers of 25 µm polyester (common practice, no source).
import type { WireOption } from '@shared/engine/types';
import { formatNominalMillimetres } from './wire';

export const FOIL_THICKNESSES = [0.05e-3, 0.08e-3, 0.1e-3, 0.15e-3, 0.2e-3, 0.3e-3, 0.4e-3, 0.5e-3, 0.8e-3, 1e-3, 1.5e-3, 2e-3] as const;
export const FOIL_INTERLAYER_FILM = 2 * 25e-6;

export function foilOption(thickness: number, film = FOIL_INTERLAYER_FILM): WireOption {
  return {
    id: `foil ${formatNominalMillimetres(thickness)} mm`,
    kind: 'foil',
    strandDiameter: thickness,
    strands: 1,
    overallDiameter: thickness + film,
    conductorsPerTurn: 1,
  };
}

export function standardFoilOptions(): WireOption[] {
  return FOIL_THICKNESSES.map((t) => foilOption(t));
}
