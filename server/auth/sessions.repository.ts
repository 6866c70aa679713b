import type { Db } from '../db/db';

/** Ends every session of a user (after a password reset). */
export async function deleteSessionsOfUser(db: Db, userId: number): Promise<number> {
  return db('sessions').whereRaw("JSON_VALUE(sess, '$.userId') = ?", [String(userId)]).delete();
}
