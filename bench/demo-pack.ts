/**
 * The print pack of the demo board as render requests: each pack output on its usual medium,
 * built from the demo board stored in the benchmark's database.
 */
import { asc, isNull } from 'drizzle-orm';
import type { Database } from '../server/db/client.js';
import { boards } from '../server/db/schema.js';
import { packOutputs } from '../server/print/pack.js';
import { defaultMedia } from '../server/print/query.js';
import { scheduleSchema } from '../shared/schemas/schedule.js';
import type { RenderRequest } from '../server/pdf/types.js';
import { requestFor } from './render-request.js';

export async function demoPackRenders(database: Database): Promise<RenderRequest[]> {
  const [board] = await database.db.select({ schedule: boards.schedule }).from(boards).where(isNull(boards.deletedAt)).orderBy(asc(boards.id)).limit(1);
  if (!board) throw new Error('no demo board');
  const schedule = scheduleSchema.parse(typeof board.schedule === 'string' ? JSON.parse(board.schedule) : board.schedule);
  // The tag goes on 36 mm tape in the pack when the QR does not fit the usual one.
  return packOutputs.map((output) => requestFor(output, output === 'tag' ? 'tape-36' : defaultMedia[output], schedule));
}
