import type { Db } from '../db/db';

export type UserRow = { id: number; email: string; name: string; password_hash: string; created_at: Date };

export async function findUserByEmail(db: Db, email: string): Promise<UserRow | undefined> {
  return db<UserRow>('users').where({ email }).first();
}

export async function findUserById(db: Db, id: number): Promise<UserRow | undefined> {
  return db<UserRow>('users').where({ id }).first();
}

export async function insertUser(db: Db, user: { email: string; name: string; passwordHash: string }): Promise<number> {
  const [id] = await db('users').insert({ email: user.email, name: user.name, password_hash: user.passwordHash });
  await db('user_settings').insert({ user_id: id, unit_system: 'SI' });
  return id;
}

export async function updateUserPassword(db: Db, id: number, passwordHash: string): Promise<void> {
  await db('users').where({ id }).update({ password_hash: passwordHash, updated_at: db.fn.now(3) });
}
