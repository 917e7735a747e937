import type { MatrixRows } from './types.js';

const everyone = ['technician', 'assessor', 'manager', 'auditor', 'admin'] as const;

// Everyone may ask: a person sees their own evidence, covering assessors and managers their sites', auditors and admins all.
export const rows: MatrixRows = {
  'GET /evidence': [...everyone],
  'POST /evidence': ['technician', 'assessor', 'manager'],
  'GET /evidence/:id': [...everyone],
  'GET /evidence/:id/content': [...everyone],
};
