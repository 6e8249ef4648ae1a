import { describe, expect, it } from 'vitest';
import * as z from 'zod';
import {
  converterSpecSchema,
  coreLossRequestSchema,
  evaluateRequestSchema,
  operatingPointRequestSchema,
  searchRequestSchema,
} from '@shared/schemas/calc';

const spec = { vinMin: 24, vinMax: 36, vout: 12, ioutMax: 10, frequency: 100e3, rippleRatio: 0.3 };

function issueAt(result: { success: boolean; error?: z.ZodError }, path: string) {
  return result.error?.issues.find((issue) => issue.path.join('.') === path);
}

describe('calculation request schemas', () => {
  it('accepts the worked buck example spec and fills the rectifier default', () => {
    const parsed = converterSpecSchema.parse(spec);
    expect(parsed.rectifier).toBe('ideal');
  });

  it('names the field and the range when a value is out of range', () => {
    const result = operatingPointRequestSchema.safeParse({ ...spec, frequency: 500 });
    expect(issueAt(result, 'frequency')?.message).toBe('frequency must be between 1000 and 10000000 Hz');
    expect(issueAt(converterSpecSchema.safeParse({ ...spec, rippleRatio: 3 }), 'rippleRatio')?.message).toBe(
      'rippleRatio must be between 0.01 and 2',
    );
  });

  it('rejects non-finite numbers and unknown fields', () => {
    expect(converterSpecSchema.safeParse({ ...spec, vout: Number.NaN }).success).toBe(false);
    expect(converterSpecSchema.safeParse({ ...spec, vout: Number.POSITIVE_INFINITY }).success).toBe(false);
    expect(issueAt(converterSpecSchema.safeParse({ ...spec, extra: 1 }), '')?.code).toBe('unrecognized_keys');
  });

  it('puts cross-field problems on the offending field', () => {
    expect(issueAt(converterSpecSchema.safeParse({ ...spec, vout: 30, vinMin: 24 }), 'vout')).toBeDefined();
    expect(issueAt(converterSpecSchema.safeParse({ ...spec, vinMin: 40 }), 'vinMin')).toBeDefined();
    expect(issueAt(converterSpecSchema.safeParse({ ...spec, inductance: 20e-6 }), 'inductance')?.message).toMatch(/exactly one/);
    const { rippleRatio: _r, ...none } = spec;
    expect(issueAt(converterSpecSchema.safeParse(none), 'rippleRatio')).toBeDefined();
  });

  it('nests the spec path inside search and evaluate requests', () => {
    const search = searchRequestSchema.safeParse({ spec: { ...spec, vout: 30 }, materialIds: ['1'] });
    expect(issueAt(search, 'spec.vout')).toBeDefined();
    expect(issueAt(searchRequestSchema.safeParse({ spec }), 'materialIds')).toBeDefined();
    const ok = searchRequestSchema.parse({ spec, materialIds: ['1'] });
    expect(ok.rankBy).toBe('smallest');
    expect(ok.limit).toBe(20);
  });

  it('bounds the minimum gap to 0…5 mm, names it, and takes a spacer placement', () => {
    const wire = { kind: 'awg', awg: 18, strands: 1 };
    const base = { spec, coreId: 'ETD34', materialId: '7', wire };
    expect(evaluateRequestSchema.parse({ ...base, limits: { minGap: 50e-6 }, placement: 'spacer' }).placement).toBe('spacer');
    expect(issueAt(evaluateRequestSchema.safeParse({ ...base, limits: { minGap: 6e-3 } }), 'limits.minGap')?.message).toBe(
      'minGap must be between 0 and 0.005 m',
    );
    expect(issueAt(evaluateRequestSchema.safeParse({ ...base, placement: 'glued' }), 'placement')).toBeDefined();
  });

  it('validates an evaluate request with auto turns and a wire by gauge', () => {
    const parsed = evaluateRequestSchema.parse({ spec, coreId: 'ETD34', materialId: '7', wire: { kind: 'awg', awg: 18, strands: 2 } });
    expect(parsed.turns).toBe('auto');
    expect(parsed.gap).toBe('auto');
    const both = evaluateRequestSchema.safeParse({
      spec,
      coreId: 'ETD34',
      materialId: '7',
      wire: { kind: 'metric', strandDiameter: 0.5e-3, awg: 24, strands: 1 },
    });
    expect(issueAt(both, 'wire.strandDiameter')).toBeDefined();
    expect(issueAt(both, 'wire.awg')).toBeDefined();
  });

  it('bounds the core-loss request: α 1–3, β 1.5–4, duty inside (0, 1)', () => {
    const good = { material: { k: 3, alpha: 1.4, beta: 2.6 }, frequency: 100e3, deltaB: 0.1, duty: 0.3, waveform: 'triangle' };
    expect(coreLossRequestSchema.safeParse(good).success).toBe(true);
    expect(
      issueAt(coreLossRequestSchema.safeParse({ ...good, material: { k: 3, alpha: 3.5, beta: 2.6 } }), 'material.alpha')?.message,
    ).toBe('alpha must be between 1 and 3');
    expect(issueAt(coreLossRequestSchema.safeParse({ ...good, duty: 1 }), 'duty')).toBeDefined();
  });

  it('produces JSON Schema with field descriptions', () => {
    const json = z.toJSONSchema(searchRequestSchema, { io: 'input' }) as {
      properties: Record<string, { properties?: Record<string, { description?: string }> }>;
    };
    expect(json.properties['spec']?.properties?.['frequency']?.description).toMatch(/Switching frequency/);
    expect(() => z.toJSONSchema(evaluateRequestSchema, { io: 'input' })).not.toThrow();
    expect(() => z.toJSONSchema(coreLossRequestSchema)).not.toThrow();
  });
});
