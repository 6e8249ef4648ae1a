// Three invented converters, each with a saved design owned by the demo engineer "erin". The converters are
// made up for the demo; the designs are the engine's best candidates over the demo (illustrative) materials.
import { and, eq } from 'drizzle-orm';
import { ENGINE_VERSION, searchCandidates, type ConverterSpec } from '@shared/engine/index';
import { gapInputOf } from '@shared/engine/types';
import { wireRequestOf, type DesignSpec, type StoredResult } from '@shared/schemas/designs';
import { CatalogueService } from '../catalogue/catalogue.service.ts';
import type { Db } from '../db/client.ts';
import { designRevisions, designs, materials, users } from '../db/schema.ts';
import { designNumber } from '../designs/designs.repository.ts';
import { toCoreMaterial } from '../materials/material-view.ts';

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

export interface DemoDesign {
  title: string;
  spec: DesignSpec;
}

export const DEMO_DESIGNS: readonly DemoDesign[] = [
  {
    title: 'Telecom rail 48 V → 12 V, 8 A (invented demo converter)',
    spec: {
      converter: {
        vinMin: 36,
        vinNom: 48,
        vinMax: 60,
        vout: 12,
        ioutMax: 8,
        ioutMin: 1,
        frequency: 200e3,
        rippleRatio: 0.3,
        rectifier: 'synchronous',
        currentLimit: 11,
      },
      limits: { ambient: 50, maxRise: 40 },
      families: ['ETD', 'PQ', 'E', 'RM'],
    },
  },
  {
    title: 'Industrial board 24 V → 5 V, 4 A (invented demo converter)',
    spec: {
      converter: {
        vinMin: 18,
        vinNom: 24,
        vinMax: 32,
        vout: 5,
        ioutMax: 4,
        ioutMin: 0.4,
        frequency: 250e3,
        rippleRatio: 0.3,
        rectifier: 'diode',
        diodeDrop: 0.45,
        currentLimit: 5.5,
      },
      limits: { ambient: 60, maxRise: 40 },
    },
  },
  {
    title: 'Point-of-load 12 V → 1.2 V, 15 A (invented demo converter)',
    spec: {
      converter: {
        vinMin: 10.8,
        vinNom: 12,
        vinMax: 13.2,
        vout: 1.2,
        ioutMax: 15,
        ioutMin: 2,
        frequency: 500e3,
        rippleRatio: 0.35,
        rectifier: 'synchronous',
        currentLimit: 20,
      },
      limits: { ambient: 55, maxRise: 40 },
    },
  },
];

/** Runs inside the demo seed transaction, after the demo users and materials exist. */
export async function seedDemoDesigns(tx: Tx): Promise<number> {
  const [owner] = await tx.select().from(users).where(eq(users.username, 'erin'));
  if (!owner) return 0;
  const rows = await tx
    .select()
    .from(materials)
    .where(and(eq(materials.current, true), eq(materials.retired, false)));
  const engineMaterials = rows.map(toCoreMaterial);
  const catalogue = new CatalogueService();
  let created = 0;
  for (const demo of DEMO_DESIGNS) {
    const cores = demo.spec.families ? catalogue.cores().filter((c) => demo.spec.families!.includes(c.family)) : catalogue.cores();
    const search = searchCandidates({
      spec: demo.spec.converter as ConverterSpec,
      limits: demo.spec.limits,
      cores,
      materials: engineMaterials,
      wires: catalogue.standardWires(),
      limit: 1,
    });
    const best = search.candidates[0];
    const [placeholder] = await tx
      .insert(designs)
      .values({ number: `tmp-seed-${created}`, title: demo.title, ownerId: owner.id })
      .returning();
    await tx
      .update(designs)
      .set({ number: designNumber(placeholder.id) })
      .where(eq(designs.id, placeholder.id));
    const evaluation = best?.result;
    const result: StoredResult | null = best ? { wire: best.wire, evaluation } : null;
    await tx.insert(designRevisions).values({
      designId: placeholder.id,
      revision: 1,
      status: 'draft',
      spec: demo.spec,
      construction: best
        ? {
            coreId: best.result.core.id,
            materialId: best.result.material.id,
            turns: best.result.turns,
            // As a saved construction holds it (construction-evaluator.ts): the ground gap or the spacer thickness,
            // with its placement and the keep-out the search chose, so reopening the design evaluates the same part.
            gap: gapInputOf(best.result.gap),
            placement: best.result.gap.placement,
            ...(best.result.winding.keepOut !== undefined ? { keepOut: best.result.winding.keepOut } : {}),
            wire: wireRequestOf(best.wire),
          }
        : null,
      result,
      engineVersion: best ? ENGINE_VERSION : null,
      materialId: best ? Number(best.result.material.id) : null,
      note: 'Seeded demo design (invented converter, illustrative materials)',
      createdBy: owner.id,
    });
    created++;
  }
  return created;
}
