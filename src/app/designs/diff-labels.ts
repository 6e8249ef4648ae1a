import { formatQuantity, trimmedNumber, type QuantityKind } from '@shared/units/index';

/** How a revision diff names a figure and shows its values: words and the quantity whose unit applies. */
interface FigureName {
  label: string;
  kind?: QuantityKind;
}

const n = (label: string, kind?: QuantityKind): FigureName => (kind ? { label, kind } : { label });

/** The figures of spec, construction and results by their path in the stored records (leaf lists by index drop). */
const FIGURES: Record<string, FigureName> = {
  'converter.vinMin': n('Input voltage, lowest', 'voltage'),
  'converter.vinNom': n('Input voltage, nominal', 'voltage'),
  'converter.vinMax': n('Input voltage, highest', 'voltage'),
  'converter.vout': n('Output voltage', 'voltage'),
  'converter.ioutMax': n('Output current, full load', 'current'),
  'converter.ioutMin': n('Output current, lightest load', 'current'),
  'converter.frequency': n('Switching frequency', 'frequency'),
  'converter.rippleRatio': n('Ripple, share of full-load current', 'ratio'),
  'converter.rippleCurrent': n('Ripple current, peak to peak', 'current'),
  'converter.inductance': n('Inductance asked for', 'inductance'),
  'converter.rectifier': n('Rectifier'),
  'converter.diodeDrop': n('Diode drop', 'voltage'),
  'converter.switchDrop': n('Switch drop', 'voltage'),
  'converter.highSideResistance': n('High-side switch resistance', 'resistance'),
  'converter.lowSideResistance': n('Low-side switch resistance', 'resistance'),
  'converter.inductorResistance': n('Inductor resistance assumed', 'resistance'),
  'converter.currentLimit': n('Controller current limit', 'current'),
  'limits.ambient': n('Ambient temperature', 'temperature'),
  'limits.airSpeed': n('Air speed', 'speed'),
  'limits.boardThermalResistance': n('Core-to-board thermal resistance', 'thermalResistance'),
  'limits.maxRise': n('Largest temperature rise', 'temperatureRise'),
  'limits.lossBudget': n('Loss budget', 'power'),
  'limits.inductanceTolerance': n('Inductance tolerance', 'ratio'),
  'limits.bMax': n('Highest peak flux density', 'fluxDensity'),
  'limits.saturationMargin': n('Saturation margin', 'ratio'),
  'limits.currentDensity': n('Highest current density', 'currentDensity'),
  'limits.windowUtilisation': n('Window fill allowed', 'ratio'),
  'limits.insulationClass': n('Insulation class', 'temperature'),
  'limits.maxStrands': n('Most strands in hand', 'count'),
  'limits.minPermeabilityAtPeak': n('Least powder permeability at peak', 'ratio'),
  'limits.minGap': n('Smallest gap the shop holds', 'length'),
  coreId: n('Core'),
  materialId: n('Material (stored id)'),
  turns: n('Turns', 'count'),
  gap: n('Gap', 'length'),
  placement: n('Gap placement'),
  'wire.kind': n('Wire kind'),
  'wire.awg': n('Wire gauge (AWG)', 'count'),
  'wire.strandDiameter': n('Strand diameter', 'length'),
  'wire.strands': n('Strands in hand', 'count'),
  feasible: n('Meets every limit'),
  'operatingPoint.dutyAtVinMax': n('Duty at highest input', 'ratio'),
  'operatingPoint.dutyAtVinMin': n('Duty at lowest input', 'ratio'),
  'operatingPoint.inductanceMin': n('Inductance required', 'inductance'),
  'operatingPoint.inductanceNominal': n('Inductance to build, nominal', 'inductance'),
  'operatingPoint.rippleAtVinMax': n('Ripple at highest input', 'current'),
  'operatingPoint.rippleAtVinMin': n('Ripple at lowest input', 'current'),
  'operatingPoint.peakCurrent': n('Peak current', 'current'),
  'operatingPoint.valleyCurrent': n('Valley current', 'current'),
  'operatingPoint.rmsCurrent': n('RMS current', 'current'),
  'operatingPoint.saturationCheckCurrent': n('Current for the saturation check', 'current'),
  'core.id': n('Core'),
  'material.name': n('Material'),
  'wire.id': n('Wire'),
  'wire.copperArea': n('Copper area (m²)'),
  'wire.currentDensity': n('Current density', 'currentDensity'),
  'gap.placement': n('Gap placement'),
  'gap.total': n('Gap, total', 'length'),
  'gap.spacer': n('Spacer thickness', 'length'),
  'gap.fringingFactor': n('Fringing factor'),
  'gap.sensitivity10um': n('Inductance change for +10 µm of gap', 'ratio'),
  'inductance.nominal': n('Inductance, nominal', 'inductance'),
  'inductance.minimum': n('Inductance, lowest in tolerance', 'inductance'),
  'inductance.atLoad': n('Inductance at full load', 'inductance'),
  'inductance.atPeak': n('Inductance at peak current', 'inductance'),
  'flux.dc': n('DC flux density', 'fluxDensity'),
  'flux.acPeak': n('AC flux density, peak', 'fluxDensity'),
  'flux.swing': n('Flux swing, peak to peak', 'fluxDensity'),
  'flux.peak': n('Peak flux density', 'fluxDensity'),
  'flux.saturationAtHotSpot': n('Saturation flux density at the hot spot', 'fluxDensity'),
  'flux.saturationMargin': n('Saturation margin', 'ratio'),
  'winding.turnsPerLayer': n('Turns per layer', 'count'),
  'winding.layers': n('Layers', 'count'),
  'winding.buildHeight': n('Winding build', 'length'),
  'winding.copperFill': n('Window fill', 'ratio'),
  'winding.meanTurnLength': n('Mean length of turn', 'length'),
  'winding.wireLength': n('Wire length', 'length'),
  'copper.resistance20': n('DC resistance at 20 °C', 'resistance'),
  'copper.resistanceHot': n('DC resistance, hot', 'resistance'),
  'copper.acFactor': n('AC resistance factor'),
  'copper.skinDepth': n('Skin depth', 'length'),
  'copper.dcLoss': n('Copper loss, DC', 'power'),
  'copper.acLoss': n('Copper loss, AC', 'power'),
  'coreLoss.temperatureFactor': n('Core-loss temperature factor'),
  'coreLoss.loss': n('Core loss', 'power'),
  totalLoss: n('Total loss', 'power'),
  'thermal.riseBySurface': n('Temperature rise (surface law)', 'temperatureRise'),
  'thermal.riseByVolume': n('Temperature rise (volume law)', 'temperatureRise'),
  'thermal.coreTemperature': n('Core temperature', 'temperature'),
  'thermal.windingTemperature': n('Winding temperature', 'temperature'),
  'thermal.rise': n('Temperature rise', 'temperatureRise'),
  'thermal.surfaceTemperature': n('Surface temperature', 'temperature'),
  'thermal.hotSpot': n('Hot spot', 'temperature'),
  'thermal.runaway': n('Thermal runaway'),
};

/** "copper.acFactor" → "Copper › ac factor": a path without a name of ours, in words. */
function inWords(path: string): string {
  const words = path
    .split('.')
    .map((part) => part.replace(/([a-z])([A-Z0-9])/g, '$1 $2').toLowerCase())
    .join(' › ');
  return words.charAt(0).toUpperCase() + words.slice(1);
}

/** A figure's name in words: ours where we have one, else its path in words. */
export function figureLabel(path: string): string {
  return FIGURES[path]?.label ?? inWords(path);
}

/** A value as the page shows it: with its unit where the figure has one, yes/no, a dash for none. */
export function figureValue(path: string, value: unknown): string {
  if (value === null || value === undefined) return '—';
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (typeof value !== 'number') return typeof value === 'string' ? value : JSON.stringify(value);
  const kind = FIGURES[path]?.kind;
  // Shares are stored as fractions and read as percentages.
  if (kind === 'ratio') return `${trimmedNumber(value * 100, 4)} %`;
  if (kind) return formatQuantity(value, kind);
  return Number.isInteger(value) ? String(value) : trimmedNumber(value, 5);
}
