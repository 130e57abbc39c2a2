/**
 * SQL statements per board read, counted on the pool, for a board of 10 and one of 1000
 * circuits: a schedule is one document, so the count must not grow with the board.
 */
import request from 'supertest';
import { createApp } from '../server/app.js';
import { configFromEnv } from '../server/config.js';
import type { Database } from '../server/db/client.js';
import { smtpMailer } from '../server/mail/mailer.js';
import { BOARD_FILE_FORMAT } from '../shared/schemas/schedule.js';
import { DEMO_PASSWORD, DEMO_USERS } from '../server/seed/index.js';
import { makeSchedule as syntheticSchedule } from '../tests/helpers/boards.js';

export async function benchQueries(database: Database): Promise<{ at10: number; at1000: number }> {
  const config = configFromEnv({ DATABASE_URL: 'mysql://unused', SESSION_SECRET: 'bench' }, { smtp: { host: '127.0.0.1', port: 1, from: 'x@example.test' } });
  const built = createApp({ config, database, db: database.db, mailer: smtpMailer(config.smtp) });
  const agent = request.agent(built.app);
  const csrf = (await agent.get('/api/auth/csrf')).body.token as string;
  await agent.post('/api/auth/login').set('X-CSRF-Token', csrf).send({ email: DEMO_USERS[0].email, password: DEMO_PASSWORD }).expect(200);
  const counts: number[] = [];
  for (const n of [10, 1000]) {
    const file = { format: BOARD_FILE_FORMAT, kind: 'waymark-board', ...syntheticSchedule(n) };
    const { body } = await agent.post('/api/boards/import').set('X-CSRF-Token', csrf).send(file).expect(201);
    await agent.get(`/api/boards/${body.id}/schedule`).expect(200); // warm the session row
    const before = database.queryCount();
    const res = await agent.get(`/api/boards/${body.id}/schedule`).expect(200);
    counts.push(database.queryCount() - before);
    if (res.body.circuits.length !== n) throw new Error(`read ${res.body.circuits.length} circuits, expected ${n}`);
  }
  await built.close();
  return { at10: counts[0], at1000: counts[1] };
}
