/**
 * Fixtures for the print API tests: members of each role in an organisation, and a stored
 * board with a small invented schedule (created through the boards API, like a user would).
 */
import { users } from '../../server/db/schema.js';
import { hashPassword } from '../../server/auth/passwords.js';
import type { Role } from '../../shared/schemas/auth.js';
import type { ScheduleInput } from '../../shared/schemas/schedule.js';
import { client, TEST_PASSWORD, uniqueEmail, type Client, type TestApp } from '../helpers/app.js';

/** Adds a member with the role to the owner's organisation and returns their signed-in client. */
export async function addMember(t: TestApp, owner: Client, role: Role): Promise<Client> {
  const me = await owner.get('/api/auth/me').expect(200);
  const email = uniqueEmail(role);
  await t.database.db.insert(users).values({
    organisationId: me.body.organisation.id, email, name: `Test ${role}`, role, passwordHash: await hashPassword(TEST_PASSWORD),
  });
  const c = await client(t.app);
  await c.post('/api/auth/login', { email, password: TEST_PASSWORD }).expect(200);
  return c;
}
