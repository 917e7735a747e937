import { loadConfig } from './config.js';
import { createApp } from './app.js';
import { assertAppLogin } from './db/login-check.js';

const config = loadConfig();
await assertAppLogin(config.databaseUrl).catch((err: Error) => {
  console.error(`[server] ${err.message}`);
  process.exit(1);
});
const { app, close, jobsReady, deps } = createApp({ config, startJobs: true });
const log = deps.log;
await jobsReady;
const server = app.listen(config.port, config.host, () => {
  const addr = server.address();
  const port = typeof addr === 'object' && addr ? addr.port : config.port;
  log.info(`listening on http://${config.host}:${port}`);
});

let stopping = false;
async function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  log.info(`${signal}: closing`);
  server.close(async () => {
    await close();
    process.exit(0);
  });
  server.closeAllConnections?.();
  setTimeout(() => process.exit(1), 10_000).unref();
}
process.on('SIGINT', () => void shutdown('SIGINT'));
process.on('SIGTERM', () => void shutdown('SIGTERM'));
process.on('unhandledRejection', (reason) => {
  log.error({ err: reason }, 'unhandled rejection');
});
// Last resort, not a way to carry on: the state is unknown, so log it and exit non-zero; npm start (or
// systemd, see the README) starts a fresh process.
process.on('uncaughtException', (err) => {
  log.fatal({ err }, `uncaught exception, exiting: ${err.message}`);
  process.exit(1);
});
