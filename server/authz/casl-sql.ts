import { rulesToQuery } from '@casl/ability/extra';
import { and, eq, inArray, not, or, sql, type SQL } from 'drizzle-orm';
import type { AnyPgColumn } from 'drizzle-orm/pg-core';
import type { Action, AppAbility, SubjectName } from '../../shared/abilities.js';
import { AppError } from '../errors.js';

type Conditions = Record<string, unknown>;

/**
 * Turns the CASL rules for (action, subject) into a SQL condition over the given columns, so list
 * queries return only rows the person may read. The rules stay defined once, in shared/abilities.ts.
 */
export function accessibleWhere(
  ability: AppAbility,
  action: Action,
  subject: Exclude<SubjectName, 'all'>,
  columns: Record<string, AnyPgColumn>,
): SQL {
  const query = rulesToQuery(ability, action, subject, (rule) => {
    if (!rule.conditions) throw new AppError(500, 'rule', 'unconditional rule reached the converter');
    return rule.inverted ? { $nor: [rule.conditions] } : rule.conditions;
  });
  if (query === null) return sql`false`;
  const parts: SQL[] = [];
  const anyOf = (query.$or as Conditions[] | undefined)?.map((c) => conditionSql(c, columns));
  if (anyOf) parts.push(or(...anyOf) ?? sql`false`);
  for (const c of (query.$and as Conditions[] | undefined) ?? []) parts.push(conditionSql(c, columns));
  return parts.length ? (and(...parts) as SQL) : sql`true`;
}

function conditionSql(cond: Conditions, columns: Record<string, AnyPgColumn>): SQL {
  const parts: SQL[] = [];
  for (const [key, value] of Object.entries(cond)) {
    if (key === '$nor') {
      parts.push(not(or(...(value as Conditions[]).map((c) => conditionSql(c, columns))) as SQL));
      continue;
    }
    const column = columns[key];
    if (!column) throw new AppError(500, 'rule', `no column mapped for rule field ${key}`);
    if (value && typeof value === 'object' && '$in' in value) {
      const list = (value as { $in: unknown[] }).$in;
      parts.push(list.length ? inArray(column, list) : sql`false`);
    } else if (value && typeof value === 'object' && '$eq' in value) {
      parts.push(eq(column, (value as { $eq: unknown }).$eq));
    } else {
      parts.push(eq(column, value));
    }
  }
  return (and(...parts) as SQL) ?? sql`true`;
}
