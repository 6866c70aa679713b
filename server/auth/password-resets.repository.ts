import type { Db } from '../db/db';

export type PasswordResetRow = { id: number; user_id: number; token_hash: string; expires_at: Date; used_at: Date | null };

export async function insertPasswordReset(db: Db, row: { userId: number; tokenHash: string; expiresAt: Date }): Promise<void> {
  await db('password_resets').insert({ user_id: row.userId, token_hash: row.tokenHash, expires_at: row.expiresAt });
}

/** Locks the row so two confirmations of the same token cannot both succeed. */
export async function findUsablePasswordReset(db: Db, tokenHash: string, now: Date): Promise<PasswordResetRow | undefined> {
  return db<PasswordResetRow>('password_resets')
    .where({ token_hash: tokenHash })
    .whereNull('used_at')
    .where('expires_at', '>', now)
    .forUpdate()
    .first();
}

/** Marks this and every other open reset of the user as used. */
export async function markPasswordResetsUsed(db: Db, userId: number, now: Date): Promise<void> {
  await db('password_resets').where({ user_id: userId }).whereNull('used_at').update({ used_at: now });
}

/** The user a token was issued to, whatever its state (to check the new password against their details). */
export async function findPasswordResetUserId(db: Db, tokenHash: string): Promise<number | undefined> {
  const row = await db('password_resets').select('user_id').where({ token_hash: tokenHash }).first();
  return row?.user_id;
}
