import type { Executor } from '../db/client.js';
import type { Clock } from '../clock.js';
import type { Audit } from '../audit/audit.service.js';
import { hashPassword } from '../auth/password.js';
import { insertSite } from '../sites/sites.repository.js';
import { insertUser, replaceCoveredSites, replaceRoles } from '../people/people.repository.js';
import { DEMO_PASSWORD, DEMO_PEOPLE, DEMO_SITES } from './demo-people.js';

export async function seedPeople(tx: Executor, clock: Clock, audit: Audit) {
  const now = clock.now();
  const sites: Record<string, string> = {};
  for (const s of DEMO_SITES) {
    const row = await insertSite(tx, { ...s, createdAt: now });
    sites[s.code] = row.id;
    await audit(tx, { actorId: null, action: 'seed.site', entity: 'site', entityId: row.id, newValues: s });
  }
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  const people: Record<string, string> = {};
  for (const p of DEMO_PEOPLE) {
    const user = await insertUser(tx, { email: p.email, name: p.name, siteId: sites[p.site], passwordHash, active: true, createdAt: now, updatedAt: now });
    await replaceRoles(tx, user.id, p.roles);
    await replaceCoveredSites(tx, user.id, (p.covers ?? []).map((c) => sites[c]));
    people[p.email] = user.id;
    await audit(tx, { actorId: null, action: 'seed.person', entity: 'user', entityId: user.id, newValues: { email: p.email, roles: p.roles } });
  }
  return { sites, people };
}
