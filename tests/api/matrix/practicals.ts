import type { MatrixRows } from './types.js';

const readers = ['technician', 'assessor', 'manager', 'auditor'] as const;

// Practicals: assessors run and sign them; technicians see their own and acknowledge the outcome.
export const rows: MatrixRows = {
  'GET /practicals': [...readers],
  'POST /practicals': ['assessor'],
  'GET /practicals/technicians': ['assessor'],
  'GET /practicals/:id': [...readers],
  'PUT /practicals/:id/items/:itemId': ['assessor'],
  'POST /practicals/:id/hold-points/:stepKey': ['assessor'],
  'POST /practicals/:id/assess': ['assessor'],
  'POST /practicals/:id/acknowledge': [...readers],
  'POST /practicals/:id/corrections': ['assessor'],
};
