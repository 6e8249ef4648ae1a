import bcrypt from 'bcryptjs';
import { eq } from 'drizzle-orm';
import type { Db } from '../db/client.ts';
import { appSettings, auditLog, users } from '../db/schema.ts';
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
    await tx.insert(appSettings).values({ key: SEEDED_KEY, value: { company: DEMO_COMPANY, at: new Date().toISOString() } });
    await tx.insert(auditLog).values({ action: 'demo.seeded', target: DEMO_COMPANY });
  });
  return true;
}
