import type { MatrixRows } from './types.js';

const everyone = ['technician', 'assessor', 'manager', 'auditor', 'admin'] as const;
// Who reads registers: managers (their sites, narrowed in the query), auditors and admins. Technicians and assessors never.
const readers = ['manager', 'auditor', 'admin'] as const;

export const rows: MatrixRows = {
  'GET /register': [...readers],
  'GET /register/export.csv': [...readers],
  'GET /register/export.pdf': [...readers],
  'GET /register/:authorisationId/evidence': [...readers],
  'GET /matrix': [...readers],
  'GET /overview': [...readers],
  'POST /incident-packs': [...readers],
  'GET /findings': [...readers],
  'GET /findings/export.csv': [...readers],
  'GET /findings/:id': [...readers],
  'POST /findings': ['auditor'],
  'POST /findings/:id/answer': ['manager'],
  'POST /findings/:id/close': ['manager'],
  'GET /audit': ['auditor', 'admin'],
  'POST /audit/verify': ['auditor', 'admin'],
  // Everyone may open their own record; whose else is decided per person (tests/api/register-access.test.ts).
  'GET /people/:personId/record': [...everyone],
};
