/** An audit entry about a record: what it held before that change. */
export interface Change {
  action: string;
  oldValues: unknown;
}

const CREATED = /\.(created|seed)$|^seed\./;

/**
 * A record as it stood at a moment, from today's row and the changes the audit trail holds after that
 * moment (newest first): each change's old values are put back in turn. Null when it was created later.
 */
export function rewind<T extends object>(current: T, changesAfter: Change[]): T | null {
  let row: T = { ...current };
  for (const c of changesAfter) {
    if (CREATED.test(c.action)) return null;
    if (c.oldValues && typeof c.oldValues === 'object') row = { ...row, ...(c.oldValues as Partial<T>) };
  }
  return row;
}
