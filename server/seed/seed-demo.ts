import bcrypt from 'bcryptjs';
import { eq } from 'drizzle-orm';
import type { Db, Tx } from '../db/client.ts';
import { appSettings, auditLog, materials, users } from '../db/schema.ts';
import { seedDemoDesigns } from './demo-designs.ts';
import { DEMO_MATERIALS, kFromAnchor } from './demo-materials.ts';
import { DEMO_COMPANY, DEMO_USERS } from './demo-scenario.ts';

/**
 * The demo scenario is seeded in steps, each recorded by its own marker, so an installation seeded by
 * an older version gains the later parts on its next start and nothing is ever seeded twice.
 * ('demo_seeded' is the users step's marker, kept from the first version.)
 */
interface SeedStep {
  key: string;
  /** Slow preparation done before the transaction opens (password hashing). */
  prepare?: (bcryptCost: number) => Promise<unknown>;
  run: (tx: Tx, prepared: unknown) => Promise<unknown>;
}

const SEED_STEPS: readonly SeedStep[] = [
  { key: 'demo_seeded', prepare: hashDemoPasswords, run: (tx, hashed) => seedUsers(tx, hashed as HashedUser[]) },
  { key: 'demo_materials_seeded', run: (tx) => seedMaterials(tx) },
  { key: 'demo_designs_seeded', run: (tx) => seedDemoDesigns(tx) },
];

/** Seeds whatever part of the demo scenario this database has not had yet; returns whether anything was added. */
export async function seedDemoOnce(db: Db, bcryptCost: number): Promise<boolean> {
  let added = false;
  for (const step of SEED_STEPS) {
    const [marker] = await db.select().from(appSettings).where(eq(appSettings.key, step.key));
    if (marker) continue;
    const prepared = await step.prepare?.(bcryptCost);
    // The step and its marker commit together: a crash in between leaves neither.
    await db.transaction(async (tx) => {
      await step.run(tx, prepared);
      await tx.insert(appSettings).values({ key: step.key, value: { company: DEMO_COMPANY, at: new Date().toISOString() } });
      await tx.insert(auditLog).values({ action: 'demo.seeded', target: `${DEMO_COMPANY}: ${step.key}` });
    });
    added = true;
  }
  return added;
}

interface HashedUser {
  username: string;
  displayName: string;
  email: string;
  role: (typeof DEMO_USERS)[number]['role'];
  passwordHash: string;
}

function hashDemoPasswords(bcryptCost: number): Promise<HashedUser[]> {
  return Promise.all(
    DEMO_USERS.map(async ({ username, displayName, email, role, password }) => ({
      username,
      displayName,
      email,
      role,
      passwordHash: await bcrypt.hash(password, bcryptCost),
    })),
  );
}

async function seedUsers(tx: Tx, hashed: HashedUser[]): Promise<void> {
  await tx.insert(users).values(hashed).onConflictDoNothing({ target: users.username });
}

async function seedMaterials(tx: Tx): Promise<void> {
  await tx.insert(materials).values(
    DEMO_MATERIALS.map((m) => {
      const k = kFromAnchor(m);
      const t = m.minimumLossAt;
      return {
        lineage: m.name
          .toLowerCase()
          .replace(/[^a-z0-9]+/g, '-')
          .replace(/^-|-$/g, ''),
        version: 1,
        name: m.name,
        family: m.family,
        unitSet: 'W/m3-Hz-T' as const,
        kUploaded: k,
        k,
        alpha: m.alpha,
        beta: m.beta,
        fitFrequencyMin: m.fit.fMin,
        fitFrequencyMax: m.fit.fMax,
        fitFluxMin: m.fit.bMin,
        fitFluxMax: m.fit.bMax,
        // Factor 1 at its minimum, where k holds (common practice, no source).
        lowestLossTemperature: t?.temperature ?? null,
        lowestLossFactor: t ? 1 : null,
        lossCurvature: t?.curvature ?? null,
        referenceTemperature: t?.temperature ?? null,
        bsat25: m.bsat25,
        bsat100: m.bsat100,
        permeability: m.permeability,
        rollOffHalfField: m.rollOff?.h50 ?? null,
        rollOffSteepness: m.rollOff?.c ?? null,
        biasLossDoublingField: m.biasLoss?.doublingField ?? null,
        biasLossSteepness: m.biasLoss?.steepness ?? null,
        density: m.density,
        maxTemperature: m.maxTemperature ?? null,
        provenance: 'Invented for the Gapwright demo; illustrative, not a real material.',
      };
    }),
  );
}
