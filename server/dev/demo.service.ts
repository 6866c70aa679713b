import { findUserByEmail } from '../auth/users.repository';
import type { Db } from '../db/db';
import demo from '../../seeds/demo-credentials.json';

/** A start-up banner with the demo sign-ins when the demo data is loaded; null otherwise. */
export async function findDemoOwner(deps: { db: Db }): Promise<string | null> {
  const owner = await findUserByEmail(deps.db, demo.users[0].email);
  if (!owner) return null;
  const width = Math.max(...demo.users.map((u) => u.email.length));
  return [
    `Demo team "${demo.teamName}" — password for every demo user: ${demo.password}`,
    ...demo.users.map((u) => `  ${u.email.padEnd(width)}  ${u.role}`),
  ].join('\n');
}
