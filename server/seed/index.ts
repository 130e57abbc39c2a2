/**
 * The demo: an invented contractor, its members and boards. Idempotent: if the demo
 * organisation's owner exists, nothing is touched (a second start neither duplicates nor resets).
 */
import { inTransaction, type Db } from '../db/client.js';
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

/** Plainly invented, and says it is the demo wherever the name is printed. */
export const DEMO_CONTRACTOR = 'Quillmarsh Electrical (demo)';

/** All of it in one transaction: a start that fails half-way leaves no half-seeded demo that reads as present. */
export async function seedDemo(db: Db, seedBoards?: DemoBoardsSeeder): Promise<'created' | 'present'> {
  if (await findUserByEmail(db, DEMO_USERS[0].email)) return 'present';
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  return inTransaction(db, async (tx) => {
    const organisationId = await insertOrganisation(tx, DEMO_CONTRACTOR);
    await tx
      .update(organisations)
      .set({ contactPhone: '01632 960 418', contactEmail: 'office@quillmarsh.example' })
      .where(eq(organisations.id, organisationId));
    let ownerId = 0;
    for (const u of DEMO_USERS) {
      const id = await insertUser(tx, { organisationId, email: u.email, name: u.name, role: u.role, passwordHash });
      if (u.role === 'owner') ownerId = id;
    }
    if (seedBoards) await seedBoards(tx, organisationId, ownerId);
    return 'created' as const;
  });
}
