import { z } from 'zod';
import { route, type RouteDef } from '../routing.js';
import { pageQuery, uuidParam } from '../../shared/schemas/common.js';
import { notFound } from '../errors.js';
import type { Reminders } from './reminders.service.js';
import type { Jobs } from '../jobs/index.js';

const sendsQuery = pageQuery.omit({ q: true }).extend({ status: z.enum(['pending', 'sent', 'cancelled']).optional() });

export function reminderRoutes(reminders: Reminders, jobs: Jobs): RouteDef[] {
  return [
    route({
      method: 'post', path: '/reminders/sweep', access: ['create', 'Reminder'], status: 202,
      handler: async ({ actor }) => ({ jobId: await jobs.requestSweep(actor!.id), message: 'The sweep is queued; a worker takes it within seconds.' }),
    }),
    route({
      method: 'get', path: '/reminders/sweep/:id', access: ['read', 'Reminder'], params: uuidParam,
      handler: async ({ params }) => {
        const job = await jobs.job(params.id);
        if (!job) throw notFound('That sweep');
        return { id: job.id, state: job.state, output: job.output ?? null, createdOn: job.createdOn, completedOn: job.completedOn };
      },
    }),
    route({ method: 'get', path: '/reminders', access: ['read', 'Reminder'], query: sendsQuery, handler: async ({ actor, query }) => reminders.list(actor!, query) }),
  ];
}
