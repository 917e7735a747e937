import type { Role } from '../../../shared/roles.js';

/** Per route ("METHOD /path" as in the route table): who gets past the access check. */
export type MatrixRows = Record<string, 'public' | 'signed-in' | Role[]>;
