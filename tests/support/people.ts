import type { TestApp } from './app.js';
import { DEMO_PASSWORD } from '../../server/seed/demo-people.js';

export const DEMO = {
  admin: 'admin@demo.breakover.test',
  manager: 'manager@demo.breakover.test',
  manager2: 'manager2@demo.breakover.test',
  assessor: 'assessor@demo.breakover.test',
  technician: 'technician@demo.breakover.test',
  technician2: 'technician2@demo.breakover.test',
  technician3: 'technician3@demo.breakover.test',
  auditor: 'auditor@demo.breakover.test',
} as const;
export { DEMO_PASSWORD };

/** A supertest agent signed in as a demo person (cookie kept between requests). */
export async function signIn(t: TestApp, email: string, password = DEMO_PASSWORD) {
  const agent = t.agent();
  const res = await agent.post('/api/session').send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return Object.assign(agent, { user: res.body as { id: string; siteIds: string[]; site: { id: string } } });
}
