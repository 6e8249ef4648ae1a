// The spec form's model and its conversion to and from the API's DesignSpec (SI values throughout).
import { FormControl, FormGroup, Validators } from '@angular/forms';
import { DEFAULT_LIMITS } from '@shared/engine/inputs';
import type { CoreFamily, GapPlacement } from '@shared/engine/types';
import type { DesignSpec } from '@shared/schemas/designs';

export type RippleMode = 'ratio' | 'current' | 'inductance';
export type RectifierChoice = 'synchronous' | 'diode';

const num = (value: number | null, required = false) =>
  new FormControl<number | null>(value, required ? { validators: [Validators.required] } : {});

export function createSpecForm() {
  return new FormGroup({
    vinMin: num(null, true),
    vinNom: num(null),
    vinMax: num(null, true),
    vout: num(null, true),
    ioutMax: num(null, true),
    ioutMin: num(null),
    frequency: num(null, true),
    rippleMode: new FormControl<RippleMode>('ratio', { nonNullable: true }),
    rippleRatio: num(0.3),
    rippleCurrent: num(null),
    inductance: num(null),
    rectifier: new FormControl<RectifierChoice>('synchronous', { nonNullable: true }),
    diodeDrop: num(0.5),
    currentLimit: num(null),
    ambient: num(DEFAULT_LIMITS.ambient),
    airSpeed: num(DEFAULT_LIMITS.airSpeed),
    boardThermalResistance: num(null),
    maxRise: num(DEFAULT_LIMITS.maxRise),
    lossBudget: num(null),
    inductanceTolerance: num(DEFAULT_LIMITS.inductanceTolerance),
    bMax: num(DEFAULT_LIMITS.bMax),
    currentDensity: num(DEFAULT_LIMITS.currentDensity),
    windowUtilisation: num(DEFAULT_LIMITS.windowUtilisation),
    minGap: num(DEFAULT_LIMITS.minGap),
    gapPlacements: new FormControl<GapPlacement[]>([], { nonNullable: true }),
    families: new FormControl<CoreFamily[]>([], { nonNullable: true }),
    materialIds: new FormControl<string[]>([], { nonNullable: true }),
  });
}
export type SpecForm = ReturnType<typeof createSpecForm>;
export type SpecFormValue = ReturnType<SpecForm['getRawValue']>;

const given = (value: number | null | undefined): value is number => value !== null && value !== undefined && Number.isFinite(value);

/** The API spec, or null while a required figure is missing. Range checks are left to the server's schema. */
export function specFromForm(v: SpecFormValue): DesignSpec | null {
  if (![v.vinMin, v.vinMax, v.vout, v.ioutMax, v.frequency].every(given)) return null;
  const ripple =
    v.rippleMode === 'ratio'
      ? { rippleRatio: v.rippleRatio }
      : v.rippleMode === 'current'
        ? { rippleCurrent: v.rippleCurrent }
        : { inductance: v.inductance };
  if (!given(Object.values(ripple)[0])) return null;
  const optional = <K extends string>(key: K, value: number | null) => (given(value) ? { [key]: value } : {});
  const limits = {
    ...optional('ambient', v.ambient),
    ...optional('airSpeed', v.airSpeed),
    ...optional('boardThermalResistance', v.boardThermalResistance),
    ...optional('maxRise', v.maxRise),
    ...optional('lossBudget', v.lossBudget),
    ...optional('inductanceTolerance', v.inductanceTolerance),
    ...optional('bMax', v.bMax),
    ...optional('currentDensity', v.currentDensity),
    ...optional('windowUtilisation', v.windowUtilisation),
    ...optional('minGap', v.minGap),
    ...(v.gapPlacements.length ? { gapPlacements: v.gapPlacements } : {}),
  };
  return {
    converter: {
      vinMin: v.vinMin!,
      vinMax: v.vinMax!,
      vout: v.vout!,
      ioutMax: v.ioutMax!,
      frequency: v.frequency!,
      ...optional('vinNom', v.vinNom),
      ...optional('ioutMin', v.ioutMin),
      ...ripple,
      rectifier: v.rectifier,
      ...(v.rectifier === 'diode' ? optional('diodeDrop', v.diodeDrop) : {}),
      ...optional('currentLimit', v.currentLimit),
    } as DesignSpec['converter'],
    limits,
    ...(v.families.length ? { families: v.families } : {}),
    ...(v.materialIds.length ? { materialIds: v.materialIds } : {}),
  };
}

export function formFromSpec(spec: DesignSpec): Partial<SpecFormValue> {
  const c = spec.converter;
  const l = spec.limits ?? {};
  const mode: RippleMode = c.rippleRatio !== undefined ? 'ratio' : c.rippleCurrent !== undefined ? 'current' : 'inductance';
  return {
    vinMin: c.vinMin,
    vinNom: c.vinNom ?? null,
    vinMax: c.vinMax,
    vout: c.vout,
    ioutMax: c.ioutMax,
    ioutMin: c.ioutMin ?? null,
    frequency: c.frequency,
    rippleMode: mode,
    rippleRatio: c.rippleRatio ?? 0.3,
    rippleCurrent: c.rippleCurrent ?? null,
    inductance: c.inductance ?? null,
    rectifier: c.rectifier === 'diode' ? 'diode' : 'synchronous',
    diodeDrop: c.diodeDrop ?? 0.5,
    currentLimit: c.currentLimit ?? null,
    ambient: l.ambient ?? DEFAULT_LIMITS.ambient,
    airSpeed: l.airSpeed ?? DEFAULT_LIMITS.airSpeed,
    boardThermalResistance: l.boardThermalResistance ?? null,
    maxRise: l.maxRise ?? DEFAULT_LIMITS.maxRise,
    lossBudget: l.lossBudget ?? null,
    inductanceTolerance: l.inductanceTolerance ?? DEFAULT_LIMITS.inductanceTolerance,
    bMax: l.bMax ?? DEFAULT_LIMITS.bMax,
    currentDensity: l.currentDensity ?? DEFAULT_LIMITS.currentDensity,
    windowUtilisation: l.windowUtilisation ?? DEFAULT_LIMITS.windowUtilisation,
    minGap: l.minGap ?? DEFAULT_LIMITS.minGap,
    gapPlacements: [...(l.gapPlacements ?? [])],
    families: [...(spec.families ?? [])],
    materialIds: [...(spec.materialIds ?? [])],
  };
}
