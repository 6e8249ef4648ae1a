// Plain-word issue texts, built only for candidates that are shown to someone.
import { TEMPERATURE_FACTOR_FLOOR, THERMAL_MODEL_LIMIT } from './thermal';
import { FAILURE, WARNING, materialTemperatureLimit, type CandidateFigures, type SpecContext } from './kernel';
import type { MagneticDesign } from './magnetic-design';
import type { EngineIssue } from './inputs';
import type { CoreMaterial, CoreShape, WireOption } from './types';

const fmt = (value: number, digits = 2) => (Number.isFinite(value) ? value.toFixed(digits) : '∞');
const mm = (metres: number) => fmt(metres * 1e3, 2);
const uH = (henry: number) => fmt(henry * 1e6, 2);

const gapName = (mag: MagneticDesign) => (mag.placement === 'spacer' ? 'Spacer' : 'Ground gap');
const gapLength = (mag: MagneticDesign) => (mag.placement === 'spacer' ? mag.spacer : mag.totalGap);

export interface IssueSubject {
  ctx: SpecContext;
  core: CoreShape;
  material: CoreMaterial;
  mag: MagneticDesign;
  figures: CandidateFigures;
  /** The conductor, for the warnings that depend on how it is laid. */
  wire?: WireOption;
}

/** Above this Rac/Rdc of the ripple, unequal sharing between wires in hand shows in the loss (our own threshold). */
const SHARING_MATTERS_ABOVE = 1.1;

export function describeIssues({ ctx, core, material, mag, figures: f, wire }: IssueSubject): EngineIssue[] {
  const { limits, op } = ctx;
  const issues: EngineIssue[] = [];
  const error = (code: string, message: string) => issues.push({ code, severity: 'error', message });
  const warning = (code: string, message: string) => issues.push({ code, severity: 'warning', message });
  const failed = (bit: number) => (f.failures & bit) !== 0;
  const warned = (bit: number) => (f.warnings & bit) !== 0;

  if (failed(FAILURE.powderLimit)) {
    error(
      'powder-turns',
      `No turn count up to the window limit reaches ${uH(op.inductanceNominal)} µH at ${fmt(op.saturationCheckCurrent)} A: ` +
        `the best is ${uH(mag.inductanceAtPeak)} µH with ${mag.turns} turns (more turns push the core deeper into roll-off).`,
    );
  }
  if (failed(FAILURE.negativeGap)) {
    error(
      'negative-gap',
      `${mag.turns} turns on the ungapped core give only ${uH(mag.inductanceZeroBias)} µH, below the ${uH(op.inductanceNominal)} µH target: raise the turns.`,
    );
  }
  if (failed(FAILURE.inductanceShort)) {
    error(
      'inductance-short',
      `Inductance ${uH(mag.inductanceAtPeak)} µH nominal, ${uH(mag.inductanceAtPeak * (1 - limits.inductanceTolerance))} µH at −${fmt(limits.inductanceTolerance * 100, 0)} % tolerance, is below the required ${uH(op.inductanceMin)} µH.`,
    );
  }
  if (failed(FAILURE.saturation)) {
    const allowed = 1 - limits.saturationMargin;
    const where = f.fluxPeakLocal > f.fluxPeak ? ' (in the narrowest section)' : '';
    if (f.saturationMargin < limits.saturationMargin) {
      error(
        'saturation',
        `Peak flux ${fmt(f.fluxPeakLocal)} T${where} at ${fmt(limits.ambient + f.rise, 0)} °C exceeds ${fmt(allowed * 100, 0)} % of Bsat (${fmt(allowed * f.saturationFluxHot)} T of ${fmt(f.saturationFluxHot)} T).`,
      );
    } else {
      error(
        'saturation',
        `At the upper tolerance (+${fmt(limits.inductanceTolerance * 100, 0)} % L) the peak flux is ${fmt(f.fluxPeakHigh)} T${where}; at ${fmt(ctx.hottestAllowed, 0)} °C, the hottest the limits allow, that exceeds ${fmt(allowed * 100, 0)} % of Bsat (${fmt(allowed * f.saturationFluxHottest)} T of ${fmt(f.saturationFluxHottest)} T).`,
      );
    }
  }
  if (failed(FAILURE.permeabilityDrop)) {
    error(
      'permeability-drop',
      `Permeability falls to ${fmt(mag.permeabilityAtPeak * 100, 0)} % of its initial value at ${fmt(op.saturationCheckCurrent)} A; at least ${fmt(limits.minPermeabilityAtPeak * 100, 0)} % is required.`,
    );
  }
  if (failed(FAILURE.build)) {
    error(
      'build',
      Number.isFinite(f.buildHeight)
        ? `Winding needs ${mm(f.buildHeight)} mm build height (${f.layers} layers), ${core.ring ? 'the ring' : 'the bobbin'} allows ${mm(core.bobbinHeight)} mm.`
        : `The wire is too thick to lay even one turn per layer on ${core.id}.`,
    );
  }
  if (failed(FAILURE.fill)) {
    error('fill', `Copper fill ${fmt(f.copperFill)} of the window exceeds the utilisation limit ${fmt(limits.windowUtilisation)}.`);
  }
  if (failed(FAILURE.thermalRunaway)) {
    error(
      'thermal-runaway',
      `Thermal runaway: the losses grow with temperature faster than ${core.id} can shed them, so there is no steady temperature below ${THERMAL_MODEL_LIMIT} °C. The rise is shown as ${fmt(f.rise, 0)} K, where the model stops, and the losses as at ${THERMAL_MODEL_LIMIT} °C; choose a larger core, fewer turns or a lower-loss material.`,
    );
  }
  if (failed(FAILURE.temperatureRise)) {
    error(
      'temperature-rise',
      f.runaway
        ? `Temperature rise of more than ${fmt(f.rise, 0)} K (thermal runaway) exceeds the ${fmt(limits.maxRise, 0)} K limit.`
        : `Temperature rise ${fmt(f.rise, 1)} K exceeds the ${fmt(limits.maxRise, 0)} K limit (total loss ${fmt(f.totalLoss)} W).`,
    );
  }
  if (failed(FAILURE.insulation)) {
    error(
      'insulation',
      `Winding ${f.runaway ? 'above ' : ''}${fmt(f.hotSpot, 0)} °C exceeds the insulation class ${fmt(limits.insulationClass, 0)} °C.`,
    );
  }
  if (failed(FAILURE.materialTemperature)) {
    error(
      'material-temperature',
      `Core ${f.runaway ? 'above ' : ''}${fmt(f.runaway ? f.hotSpot : f.coreTemperature, 0)} °C exceeds the ${material.name} limit of ${fmt(materialTemperatureLimit(material), 0)} °C.`,
    );
  }
  if (failed(FAILURE.temperatureFactor)) {
    error(
      'temperature-factor',
      `The core-loss temperature factor of ${material.name} (ct2·T² − ct1·T + ct0) is ${fmt(f.rawTemperatureFactor, 3)} at ${fmt(f.coreTemperature, 0)} °C: a loss cannot be zero or negative, so its temperature coefficients are not valid there. The core loss is shown with the factor raised to ${TEMPERATURE_FACTOR_FLOOR}; correct the material.`,
    );
  }
  if (failed(FAILURE.lossBudget)) {
    error('loss-budget', `Total loss ${fmt(f.totalLoss)} W exceeds the budget of ${fmt(limits.lossBudget ?? 0)} W.`);
  }
  if (failed(FAILURE.gapTooSmall)) {
    error(
      'gap-too-small',
      `${gapName(mag)} of ${fmt(gapLength(mag) * 1e6, 1)} µm is below the ${fmt(limits.minGap * 1e6, 0)} µm a workshop can hold: use fewer turns, a lower-permeability material or another core.`,
    );
  }
  if (warned(WARNING.fringingRange)) {
    warning(
      'fringing-range',
      `${gapName(mag)} of ${mm(gapLength(mag))} mm is ${fmt(mag.relativeGap)}·√A of its leg: the fringing formula is only trusted below 0.3·√A.`,
    );
  }
  if (warned(WARNING.gapSensitive)) {
    warning(
      'gap-sensitive',
      `10 µm more ${mag.placement === 'spacer' ? 'spacer' : 'gap'} changes the inductance by ${fmt(mag.gapSensitivity * 100, 1)} %: the part is hard to build to its tolerance.`,
    );
  }
  if (warned(WARNING.fluxAboveLimit)) {
    warning('flux-limit', `Peak flux ${fmt(f.fluxPeak)} T is above the design limit of ${fmt(limits.bMax)} T.`);
  }
  if (warned(WARNING.frequencyFit)) {
    warning(
      'loss-fit-frequency',
      `${fmt(ctx.spec.frequency / 1e3, 0)} kHz is outside the ${fmt(material.fitFrequencyMin / 1e3, 0)}–${fmt(material.fitFrequencyMax / 1e3, 0)} kHz range the ${material.name} loss coefficients were fitted on.`,
    );
  }
  if (warned(WARNING.fluxFit)) {
    warning(
      'loss-fit-flux',
      `AC flux ${fmt((f.fluxSwing / 2) * 1e3, 1)} mT peak is outside the ${fmt(material.fitFluxMin * 1e3, 0)}–${fmt(material.fitFluxMax * 1e3, 0)} mT fitted range of ${material.name}.`,
    );
  }
  if (wire && (wire.kind === 'awg' || wire.kind === 'metric') && wire.strands > 1 && f.acFactor > SHARING_MATTERS_ABOVE) {
    warning(
      'wires-in-hand',
      `${wire.strands} wires in hand laid side by side sit at different places in the winding's field and share the ripple current unequally unless they are twisted together or transposed between layers; the AC loss (Rac/Rdc ${fmt(f.acFactor)}) assumes equal sharing. Twist them before winding, or use litz.`,
    );
  }
  if (wire?.kind === 'foil' && mag.kind === 'air-gap' && mag.totalGap > 0) {
    const gap = mag.placement === 'spacer' ? 'spacer' : 'ground';
    const model =
      "the gap's fringing field meets the foil across its width and drives eddy currents in it (the loss concentrates in the turns nearest the gap)";
    // Agreement measured against the 2-D field solution in tests/unit/solvers/foil-gap-loss.test.ts.
    const agreement =
      'modelled by a Fourier series of the window field with the foil turns as conducting slabs (against a 2-D field solution: −4 … +79 % for 0.1–0.2 mm foil beside a ground gap, −25 … −37 % for 0.5 mm foil, −35 % beside a spacer)';
    warning(
      'foil-beside-gap',
      ctx.foilGapModelled
        ? `Copper foil beside a ${gap} gap: ${model}, ${fmt(f.gapLoss, 2)} W here, ${agreement}. Keep the foil well clear of the gap, or prefer a distributed or several small gaps.`
        : `Copper foil beside a ${gap} gap: ${model}. The search leaves this loss out and ranks such parts after fully modelled ones; the design's own evaluation includes it, ${agreement}. Keep the foil well clear of the gap, or prefer a distributed or several small gaps.`,
    );
  }
  if (warned(WARNING.thermalNotConverged)) {
    warning('thermal-iteration', 'The loss–temperature iteration did not settle within 6 passes; the temperature is approximate.');
  }
  issues.push(...op.warnings);
  return issues;
}
