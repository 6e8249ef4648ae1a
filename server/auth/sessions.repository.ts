import { and, ne, sql } from 'drizzle-orm';
import type { Db } from '../db/client.ts';
import { session } from '../db/schema.ts';

/** Stored sessions seen from outside express-session: ending a user's sessions at once. */
export class SessionsRepository {
  constructor(private readonly db: Db) {}

  /** Deletes every stored session of the user except `keepSid` (the one asking); returns how many ended. */
  async endOthers(userId: number, keepSid: string): Promise<number> {
    const ended = await this.db
      .delete(session)
      .where(and(ne(session.sid, keepSid), sql`(${session.sess}->'passport'->>'user') = ${String(userId)}`))
      .returning({ sid: session.sid });
    return ended.length;
  }
}
