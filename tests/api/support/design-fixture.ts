import { eq } from 'drizzle-orm';
import { ENGINE_VERSION } from '@shared/engine/index';
import { designRevisions, designs, users } from '../../../server/db/schema.ts';
import type { TestApp } from './test-app.ts';

// Worked buck example: 24–36 V → 12 V, 10 A, 100 kHz, ripple 0.3 (ideal CCM buck relations, computed by hand).
export const EXAMPLE_SPEC = {
  vinMin: 24,
  vinMax: 36,
  vout: 12,
  ioutMax: 10,
  frequency: 100e3,
  rippleRatio: 0.3,
  rectifier: 'ideal' as const,
};

let counter = 0;

/**
 * A design with one draft revision holding a real engine result (the best search candidate over
 * the demo materials), written straight to the tables so review tests do not depend on the workspace API.
 */
export async function insertEvaluatedDesign(
  t: TestApp,
  ownerUsername: string,
  extraSpec: Record<string, unknown> = {},
  choice: { rankBy?: 'loss' | 'smallest'; gapPlacements?: ('ground' | 'spacer')[] } = {},
) {
  const [owner] = await t.db.select().from(users).where(eq(users.username, ownerUsername));
  const materialIds = (await t.services.materials.listCurrent()).map((m) => String(m.id));
  const search = await t.services.calc.search({
    spec: EXAMPLE_SPEC,
    ...(choice.gapPlacements ? { limits: { gapPlacements: choice.gapPlacements } } : {}),
    materialIds,
    rankBy: choice.rankBy ?? 'loss',
    offset: 0,
    limit: 1,
  });
  const best = search.candidates[0];
  if (!best) throw new Error('the example spec found no feasible candidate');
  counter += 1;
  const [design] = await t.db
    .insert(designs)
    .values({
      number: `TST-${String(counter).padStart(4, '0')}-${Date.now() % 100000}`,
      title: `Review fixture ${counter}`,
      ownerId: owner.id,
    })
    .returning();
  const [revision] = await t.db
    .insert(designRevisions)
    .values({
      designId: design.id,
      revision: 1,
      status: 'draft',
      spec: { ...EXAMPLE_SPEC, ...extraSpec },
      construction: {
        coreId: best.result.core.id,
        materialId: best.result.material.id,
        turns: best.result.turns,
        gap: best.result.gap.total,
        wire: best.wire,
      },
      // The shape the design workspace saves: the wire option evaluated and every figure.
      result: { wire: best.wire, evaluation: best.result },
      engineVersion: ENGINE_VERSION,
      materialId: Number(best.result.material.id),
      createdBy: owner.id,
    })
    .returning();
  return { design, revision, result: best.result };
}

/** A further draft revision of a design, copying the first one's content. */
export async function addRevision(t: TestApp, designId: number, revisionNumber: number) {
  const [first] = await t.db.select().from(designRevisions).where(eq(designRevisions.designId, designId));
  const { id: _id, createdAt: _c, updatedAt: _u, status: _s, approvedBy: _a, releasedAt: _r, ...copy } = first;
  const [revision] = await t.db
    .insert(designRevisions)
    .values({ ...copy, revision: revisionNumber, status: 'draft' })
    .returning();
  return revision;
}
