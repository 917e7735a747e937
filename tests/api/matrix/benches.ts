import type { MatrixRows } from './types.js';

const benchStaff = ['technician', 'assessor', 'manager'] as const;
const readers = [...benchStaff, 'auditor'] as const;

// Admins run sites and accounts, not benches: they are not in these rows.
export const rows: MatrixRows = {
  'GET /benches': [...readers],
  'POST /benches': ['manager'],
  'GET /benches/:id': [...readers],
  'PATCH /benches/:id': ['manager'],
  'GET /benches/:id/usability': [...readers],
  'GET /benches/:id/type-ac-decisions': [...readers],
  'POST /benches/:id/type-ac-decisions': ['manager'],
  'GET /benches/:id/pre-use-checks': [...readers],
  'POST /benches/:id/pre-use-checks': [...benchStaff],
  'GET /instruments': [...readers],
  'POST /instruments': ['manager'],
  'GET /instruments/:id': [...readers],
  'PATCH /instruments/:id': ['manager'],
  'GET /instruments/:id/usability': [...readers],
};
