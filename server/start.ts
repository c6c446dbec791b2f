import { createServer, type Server } from 'node:http';
import { createServer as createTlsServer } from 'node:https';
import { readFileSync } from 'node:fs';
import { pathToFileURL } from 'node:url';
import pino from 'pino';
import { loadConfig, type Config } from './config';
import { createApp } from './app';
import { openDatabase } from './db/connection';
import { migrate } from './db/migrate';

export interface RunningServer {
  server: Server;
  url: string;
  stop(): Promise<void>;
}

/** Connects, migrates and listens. Used by `npm start` in-process and run directly by tests as its own process. */
export async function startServer(config: Config): Promise<RunningServer> {
  const logger = pino({ level: config.LOG_LEVEL });
  const sequelize = openDatabase(config.DATABASE_URL, { syncWait: config.DB_SYNC_WAIT });
  await sequelize.authenticate();
  await migrate(sequelize);
  const { app, close } = createApp({ config, sequelize, logger });
  // Tablet cameras need HTTPS (or localhost); a certificate can be given directly instead of a proxy.
  const tls = config.TLS_CERT_FILE && config.TLS_KEY_FILE;
  const server = tls
    ? createTlsServer(
        { cert: readFileSync(config.TLS_CERT_FILE!), key: readFileSync(config.TLS_KEY_FILE!) },
        app,
      )
    : createServer(app);
  await new Promise<void>((ok, fail) => {
    server.once('error', fail);
    server.listen(config.PORT, config.HOST, () => ok());
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : config.PORT;
  let stopping: Promise<void> | undefined;
  return {
    server,
    url: `${tls ? 'https' : 'http'}://localhost:${port}`,
    stop: () =>
      (stopping ??= (async () => {
        // Stop taking requests, let the ones under way finish (a check being stored commits and answers), then
        // close the database. Board streams end at once; a request stuck for 5 s is cut.
        close();
        const closed = new Promise<void>((ok) => server.close(() => ok()));
        server.closeIdleConnections();
        const cut = setTimeout(() => server.closeAllConnections(), 5_000);
        await closed;
        clearTimeout(cut);
        await sequelize.close();
      })()),
  };
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const running = await startServer(loadConfig());
  process.stdout.write(`listening ${running.url}\n`);
  const shutdown = () => {
    running.stop().then(
      () => process.exit(0),
      () => process.exit(1),
    );
  };
  process.once('SIGTERM', shutdown);
  process.once('SIGINT', shutdown);
}
