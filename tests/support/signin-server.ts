// A separate server process for the rate-limit test: the real app on the database the test gives,
// listening on a free port, its business clock fixed at SERVER_CLOCK.
import { loadConfig } from '../../server/config.js';
import { createApp } from '../../server/app.js';
import { SettableClock } from '../../server/clock.js';

const clock = new SettableClock(process.env.SERVER_CLOCK ?? new Date().toISOString());
const { app, close } = createApp({ config: loadConfig(), clock });
const server = app.listen(0, '127.0.0.1', () => {
  const addr = server.address();
  console.log(`listening ${typeof addr === 'object' && addr ? addr.port : 0}`);
});
process.on('SIGTERM', () => {
  server.close();
  void close().then(() => process.exit(0));
});
