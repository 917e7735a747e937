import type { TestApp } from './app.js';
import { ROLES, type Role } from '../../shared/roles.js';
import { hashPassword } from '../../server/auth/password.js';
import { insertUser, replaceRoles } from '../../server/people/people.repository.js';
import { listSites } from '../../server/sites/sites.repository.js';
import { signIn } from './people.js';

export const ROLE_PASSWORD = 'single-role-test-person-pass';

/** One person per role holding only that role, at the first demo site, signed in. */
export async function oneRoleAgents(t: TestApp) {
  const [site] = (await listSites(t.deps.db)).filter((s) => s.code === 'LEJ-W1');
  const passwordHash = await hashPassword(ROLE_PASSWORD);
  const emails = {} as Record<Role, string>;
  for (const role of ROLES) {
    const now = t.clock.now();
    const u = await insertUser(t.deps.db, { email: `only-${role}@test.invalid`, name: `Only ${role}`, siteId: site.id, passwordHash, active: true, createdAt: now, updatedAt: now });
    await replaceRoles(t.deps.db, u.id, [role]);
    emails[role] = u.email;
  }
  return {
    emails,
    signInAs: (role: Role) => signIn(t, emails[role], ROLE_PASSWORD),
  };
}
