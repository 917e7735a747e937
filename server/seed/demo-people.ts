import type { Role } from '../../shared/roles.js';

/** The demo scenario: a fictional repair workshop in two places. Invented data, for the demo only. */
export const DEMO_PASSWORD = 'amber-lamp-on-bench-4';

export const DEMO_SITES = [
  { code: 'LEJ-W1', name: 'Leipzig bench workshop', timeZone: 'Europe/Berlin', personTerm: 'skilled person' as const },
  { code: 'CLE-L2', name: 'Cleveland test lab', timeZone: 'America/New_York', personTerm: 'qualified person' as const },
];

export interface DemoPerson {
  email: string;
  name: string;
  site: string;
  roles: Role[];
  covers?: string[];
}

export const DEMO_PEOPLE: DemoPerson[] = [
  { email: 'admin@demo.breakover.test', name: 'Ines Albrecht', site: 'LEJ-W1', roles: ['admin'] },
  { email: 'manager@demo.breakover.test', name: 'Jörg Łukasik', site: 'LEJ-W1', roles: ['manager'], covers: ['CLE-L2'] },
  { email: 'manager2@demo.breakover.test', name: 'Dana Whitcombe', site: 'CLE-L2', roles: ['manager'] },
  { email: 'assessor@demo.breakover.test', name: 'Priya Natarajan', site: 'LEJ-W1', roles: ['assessor', 'technician'], covers: ['CLE-L2'] },
  { email: 'technician@demo.breakover.test', name: 'Tomasz Wójcik', site: 'LEJ-W1', roles: ['technician'] },
  { email: 'technician2@demo.breakover.test', name: 'Amélie Fournier', site: 'LEJ-W1', roles: ['technician'] },
  { email: 'technician3@demo.breakover.test', name: 'Marcus Boateng', site: 'CLE-L2', roles: ['technician'] },
  { email: 'auditor@demo.breakover.test', name: 'Sigrún Hallsdóttir', site: 'LEJ-W1', roles: ['auditor'] },
];

/** One sign-in per role, printed by npm start and shown in the README. */
export const DEMO_SIGN_INS: { role: Role; email: string }[] = [
  { role: 'technician', email: 'technician@demo.breakover.test' },
  { role: 'assessor', email: 'assessor@demo.breakover.test' },
  { role: 'manager', email: 'manager@demo.breakover.test' },
  { role: 'auditor', email: 'auditor@demo.breakover.test' },
  { role: 'admin', email: 'admin@demo.breakover.test' },
];
