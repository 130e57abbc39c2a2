/**
 * The demo: an invented contractor, its members and boards. Idempotent: if the demo
 * organisation's owner exists, nothing is touched (a second start neither duplicates nor resets).
 */
import type { Db } from '../db/client.js';
import { hashPassword } from '../auth/passwords.js';
import { findUserByEmail, insertOrganisation, insertUser } from '../auth/repository.js';
import { organisations } from '../db/schema.js';
import { eq } from 'drizzle-orm';
import type { Role } from '../../shared/schemas/auth.js';

export const DEMO_PASSWORD = 'demo-password-1';
export const DEMO_USERS: Array<{ email: string; name: string; role: Role }> = [
  { email: 'owner@demo.test', name: 'Morwenna Tresize', role: 'owner' },
  { email: 'electrician@demo.test', name: 'Dafydd Penhallow', role: 'electrician' },
  { email: 'viewer@demo.test', name: 'Isobel Quarrie', role: 'viewer' },
];

export type DemoBoardsSeeder = (db: Db, organisationId: number, ownerId: number) => Promise<void>;

export async function seedDemo(db: Db, seedBoards?: DemoBoardsSeeder): Promise<'created' | 'present'> {
  if (await findUserByEmail(db, DEMO_USERS[0].email)) return 'present';
  const organisationId = await insertOrganisation(db, 'Brightwire Electrical Ltd');
  await db.update(organisations).set({ contactPhone: '01632 960 418', contactEmail: 'office@brightwire.example' }).where(eq(organisations.id, organisationId));
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  let ownerId = 0;
  for (const u of DEMO_USERS) {
    const id = await insertUser(db, { organisationId, email: u.email, name: u.name, role: u.role, passwordHash });
    if (u.role === 'owner') ownerId = id;
  }
  if (seedBoards) await seedBoards(db, organisationId, ownerId);
  return 'created';
}
