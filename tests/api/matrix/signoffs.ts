import type { MatrixRows } from './types.js';

const fillers = ['technician', 'assessor'] as const;
const readers = ['technician', 'assessor', 'manager', 'auditor'] as const;

// Sign-offs: bench staff fill in their own; assessors countersign other people's; managers and auditors read.
export const rows: MatrixRows = {
  'GET /signoffs': [...readers],
  'POST /signoffs': [...fillers],
  'GET /signoffs/:id': [...readers],
  'PUT /signoffs/:id/items/:itemId': [...fillers],
  'POST /signoffs/:id/submit': [...fillers],
  'POST /signoffs/:id/countersign': ['assessor'],
  'POST /signoffs/:id/return': ['assessor'],
  'POST /signoffs/:id/corrections': [...fillers],
};
