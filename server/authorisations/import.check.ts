import type { Executor } from '../db/client.js';
import { grantableRoles, subjectOf, type Actor, type AppAbility } from '../../shared/abilities.js';
import { ROLES, type Role } from '../../shared/roles.js';
import { findUserByEmail } from '../people/people.repository.js';
import { listSites } from '../sites/sites.repository.js';
import { findPerson, type PersonRow } from './facts.repository.js';
import { scopesWithRequirements, type ScopeRow } from './scopes.repository.js';
import { overlapping } from './periods.repository.js';
import { priorProblems } from './prior.js';
import { endOfLocalDay, startOfLocalDay } from './dates.js';
import type { ImportRow } from './import.parse.js';
import { isRealDate, DATE_RANGE_MESSAGE } from '../../shared/schemas/common.js';
import { textProblem, type TextRules } from '../../shared/schemas/text.js';

export interface NewPerson {
  email: string;
  name: string;
  siteId: string;
  timeZone: string;
  roles: Role[];
}

export interface PlannedRow {
  row: ImportRow;
  problems: string[];
  holder: PersonRow | null;
  newPerson: NewPerson | null;
  scope: ScopeRow | null;
}

const DATE = /^\d{4}-\d{2}-\d{2}$/;
const EMAIL = /^[^\s@]+@[^\s@]+\.[^\s@]+$/;
const validDate = isRealDate;
const dateProblem = (s: string) => (DATE.test(s) ? DATE_RANGE_MESSAGE : 'use the form YYYY-MM-DD');
// The same rules as the forms' fields (shared/schemas/text.ts), with the same length limits.
const CELL_RULES: [keyof ImportRow, TextRules, number][] = [
  ['email', {}, 254], ['name', { letter: true }, 120], ['site', {}, 20], ['roles', {}, 200], ['scope', {}, 24],
  ['attested_by', { letter: true }, 200], ['note', { multiline: true }, 1000],
];

/** A row's cells that break the text rules, as "column: problem". */
function cellProblems(row: ImportRow): string[] {
  return CELL_RULES.flatMap(([col, rules, max]) => {
    const v = String(row[col]);
    const problem = textProblem(v, rules) ?? (v.length > max ? `must have at most ${max} characters` : null);
    return problem ? [`${col}: ${problem}`] : [];
  });
}

/** Every row's problems, worked out against the database without writing anything. */
export async function checkImport(db: Executor, actor: Actor, ability: AppAbility, rows: ImportRow[], now: Date): Promise<PlannedRow[]> {
  const sites = await listSites(db);
  const scopes = new Map((await scopesWithRequirements(db)).map((s) => [s.code, s]));
  const grantable = grantableRoles(actor);
  const seenPeople = new Map<string, NewPerson>();
  const planned: PlannedRow[] = [];
  for (const row of rows) {
    const problems: string[] = [];
    let holder: PersonRow | null = null;
    let newPerson: NewPerson | null = null;
    const cells = cellProblems(row);
    if (cells.length) {
      planned.push({ row, problems: cells, holder, newPerson, scope: null });
      continue;
    }
    if (!EMAIL.test(row.email)) problems.push('email: not an e-mail address');
    const existing = problems.length ? undefined : await findUserByEmail(db, row.email);
    if (existing) {
      holder = (await findPerson(db, existing.id)) ?? null;
      if (holder && !ability.can('create', subjectOf('Authorisation', { holderId: holder.id, siteId: holder.siteId }))) problems.push('email: this person is at a site you do not cover');
      if (holder?.id === actor.id) problems.push('email: you may not record an authorisation for yourself');
    } else if (!problems.length) {
      newPerson = seenPeople.get(row.email) ?? null;
      if (!newPerson) {
        const site = sites.find((s) => s.code.toUpperCase() === row.site.toUpperCase());
        const roles = (row.roles || 'technician').split(/[;|\s]+/).filter(Boolean) as Role[];
        if (!row.name) problems.push('name: a new person needs a name');
        if (!site) problems.push(`site: no site with code “${row.site}”`);
        else if (!ability.can('invite', subjectOf('User', { siteId: site.id }))) problems.push(`site: you may not add people to ${site.code}`);
        const bad = roles.filter((r) => !(ROLES as readonly string[]).includes(r));
        if (bad.length) problems.push(`roles: unknown role(s) ${bad.join(', ')}`);
        else if (roles.some((r) => !grantable.includes(r))) problems.push(`roles: you may give only ${grantable.join(', ')}`);
        if (!problems.length && site) seenPeople.set(row.email, (newPerson = { email: row.email, name: row.name, siteId: site.id, timeZone: site.timeZone, roles }));
      }
    }
    // A row with no scope and no dates adds only the person.
    const personOnly = !row.scope && !row.issued_on && !row.expires_on && !row.attested_by;
    if (personOnly) {
      if (existing) problems.push('email: this person is already in the portal and the row names no authorisation');
      planned.push({ row, problems, holder, newPerson, scope: null });
      continue;
    }
    const scope = scopes.get(row.scope) ?? null;
    if (!scope) problems.push(`scope: no scope with code “${row.scope}”`);
    if (!validDate(row.issued_on)) problems.push(`issued_on: ${dateProblem(row.issued_on)}`);
    if (!validDate(row.expires_on)) problems.push(`expires_on: ${dateProblem(row.expires_on)}`);
    if (row.attested_by.length < 3) problems.push('attested_by: name who attested the paper record');
    const who = holder ?? (newPerson ? { id: '', name: newPerson.name, email: newPerson.email, active: true, siteId: newPerson.siteId, siteName: '', timeZone: newPerson.timeZone } : null);
    if (who && validDate(row.issued_on) && validDate(row.expires_on)) {
      for (const [field, message] of priorProblems(who, { issuedOn: row.issued_on, expiresOn: row.expires_on }, now)) problems.push(`${field === 'holderId' ? 'email' : field === 'issuedOn' ? 'issued_on' : 'expires_on'}: ${message}`);
      if (!problems.length && scope) {
        const from = startOfLocalDay(row.issued_on, who.timeZone);
        const to = endOfLocalDay(row.expires_on, who.timeZone);
        if (holder && (await overlapping(db, holder.id, scope.id, from, to)).length) problems.push('issued_on: overlaps a period this person already holds for this scope');
        const twin = planned.find((p) => p.row.email === row.email && p.scope?.id === scope.id && !(endOfLocalDay(p.row.expires_on, who.timeZone) <= from || to <= startOfLocalDay(p.row.issued_on, who.timeZone)));
        if (twin) problems.push(`scope: overlaps line ${twin.row.line} for the same person and scope`);
      }
    }
    planned.push({ row, problems, holder, newPerson, scope });
  }
  return planned;
}
