/**
 * Production entry: reads the environment, opens the database and listens.
 * (`npm start` runs scripts/start.ts, which also prepares a private database and the mail fake.)
 */
import { join } from 'node:path';
import { configFromEnv } from './config.js';
import { startServer } from './server.js';

const config = configFromEnv(process.env, { clientDir: join(import.meta.dirname, '..', 'dist') });
const running = await startServer(config);
console.log(`Waymark listening on ${config.publicBaseUrl} (port ${running.port})`);
for (const sig of ['SIGINT', 'SIGTERM'] as const) {
  process.on(sig, async () => {
    await running.stop();
    process.exit(0);
  });
}
