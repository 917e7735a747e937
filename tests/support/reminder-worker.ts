// A second server process for the exactly-once test: the real app with its own pg-boss and worker on
// the same database, its business clock fixed at the moment the test gives.
import { loadConfig } from '../../server/config.js';
import { createApp } from '../../server/app.js';
import { SettableClock } from '../../server/clock.js';

const clock = new SettableClock(process.env.WORKER_CLOCK ?? new Date().toISOString());
const { jobsReady, close } = createApp({ config: loadConfig(), clock, startJobs: { pollSeconds: 0.5, schedule: false } });
await jobsReady;
console.log(`worker ready ${process.pid}`);
process.on('SIGTERM', () => {
  void close().then(() => process.exit(0));
});
