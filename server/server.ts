import type { Server } from 'node:http';
import { createApp } from './app.js';
import type { ServerConfig } from './config.js';
import { openDatabase } from './db/client.js';
import { smtpMailer } from './mail/mailer.js';
import type { AppContext } from './context.js';
import { closeRenderPool, warmRenderPool } from './print/workers/pool.js';

export interface RunningServer {
  port: number;
  ctx: AppContext;
  stop(): Promise<void>;
}

/** Opens the database, builds the app and listens on `config.port` (0 picks a free port). */
export async function startServer(config: ServerConfig): Promise<RunningServer> {
  const database = openDatabase(config.databaseUrl);
  const mailer = smtpMailer({ ...config.smtp, tagOrganisation: config.devMail });
  const ctx: AppContext = { config, database, db: database.db, mailer };
  const built = createApp(ctx);
  // The render threads load the print engine now, so the first print does not wait for them.
  warmRenderPool({ threads: config.printThreads ?? undefined });
  const server: Server = await new Promise((resolve) => {
    const s = built.app.listen(config.port, () => resolve(s));
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : config.port;
  return {
    port,
    ctx,
    async stop() {
      const closed = new Promise<void>((r) => server.close(() => r()));
      server.closeAllConnections();
      await closed;
      await built.close();
      await closeRenderPool();
      mailer.close();
      await database.close();
    },
  };
}
