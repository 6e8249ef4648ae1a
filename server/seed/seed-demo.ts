import bcrypt from 'bcryptjs';
import { eq } from 'drizzle-orm';
import type { Db } from '../db/client.ts';
import { appSettings, auditLog, materials, users } from '../db/schema.ts';
import { seedDemoDesigns } from './demo-designs.ts';
import { DEMO_MATERIALS, kFromAnchor } from './demo-materials.ts';
import { DEMO_COMPANY, DEMO_USERS } from './demo-scenario.ts';

const SEEDED_KEY = 'demo_seeded';

/** Seeds the invented demo scenario once; later starts find the marker and do nothing. */
export async function seedDemoOnce(db: Db, bcryptCost: number): Promise<boolean> {
  const [marker] = await db.select().from(appSettings).where(eq(appSettings.key, SEEDED_KEY));
  if (marker) return false;
  const hashed = await Promise.all(
    DEMO_USERS.map(async (u) => ({ ...u, passwordHash: await bcrypt.hash(u.password, bcryptCost) })),
  );
  await db.transaction(async (tx) => {
    await tx
      .insert(users)
      .values(hashed.map(({ username, displayName, email, role, passwordHash }) => ({ username, displayName, email, role, passwordHash })))
      .onConflictDoNothing({ target: users.username });
    await tx.insert(materials).values(
      DEMO_MATERIALS.map((m) => {
        const k = kFromAnchor(m);
        const t = m.minimumLossAt;
        return {
          lineage: m.name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, ''),
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
          // Parabola normalised to 1 at its minimum (magnetics reference §8.3).
          ct2: t?.ct2 ?? null,
          ct1: t ? 2 * t.ct2 * t.temperature : null,
          ct0: t ? 1 + t.ct2 * t.temperature ** 2 : null,
          referenceTemperature: t?.temperature ?? null,
          bsat25: m.bsat25,
          bsat100: m.bsat100,
          permeability: m.permeability,
          rollOffA: m.rollOff ? 1 : null,
          rollOffB: m.rollOff ? m.rollOff.h50 ** -m.rollOff.c : null,
          rollOffC: m.rollOff?.c ?? null,
          density: m.density,
          provenance: 'Invented for the Gapwright demo; illustrative, not a real material.',
        };
      }),
    );
    await seedDemoDesigns(tx);
    await tx.insert(appSettings).values({ key: SEEDED_KEY, value: { company: DEMO_COMPANY, at: new Date().toISOString() } });
    await tx.insert(auditLog).values({ action: 'demo.seeded', target: DEMO_COMPANY });
  });
  return true;
}
