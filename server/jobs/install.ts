import PgBoss from 'pg-boss';
import pg from 'pg';
import { QUEUE_OPTIONS } from './queues.js';

export const JOBS_SCHEMA = 'pgboss';

/**
 * pg-boss's schema and every queue (each queue is a partition table), made by the owner at migration time,
 * then the application role's rights on them: at run time the app only reads and writes rows.
 */
export async function installJobQueues(ownerUrl: string): Promise<void> {
  const boss = new PgBoss({ connectionString: ownerUrl, schema: JOBS_SCHEMA, max: 1, migrate: true, supervise: false, schedule: false });
  boss.on('error', (err) => console.error(`[jobs] ${err.message}`));
  await boss.start();
  try {
    // In sequence, and only when missing: creating one queue from two processes at once can deadlock.
    for (const q of QUEUE_OPTIONS) if (!(await boss.getQueue(q.name))) await boss.createQueue(q.name, q.options);
  } finally {
    await boss.stop({ graceful: false });
  }
  const client = new pg.Client({ connectionString: ownerUrl });
  client.on('error', () => undefined); // a dropped connection also rejects the pending query, which says it
  await client.connect();
  try {
    await client.query(`grant usage on schema ${JOBS_SCHEMA} to breakover_app;
      grant select, insert, update, delete on all tables in schema ${JOBS_SCHEMA} to breakover_app`);
  } finally {
    await client.end();
  }
}
