import type { MatrixRows } from './types.js';

const everyone = ['technician', 'assessor', 'manager', 'auditor', 'admin'] as const;
const readers = [...everyone];
// Bench staff see published versions only; the service and the SQL filter do the rest (procedures.list.test.ts).
export const rows: MatrixRows = {
  'GET /procedures': readers,
  'POST /procedures': ['manager'],
  'POST /procedures/review-reminders/run': ['manager', 'admin'],
  'GET /procedures/:id': readers,
  'GET /procedures/:id/compare': readers,
  'POST /procedures/:id/versions': ['manager'],
  'GET /procedures/:id/versions/:versionId': readers,
  'PUT /procedures/:id/versions/:versionId': ['manager'],
  'POST /procedures/:id/versions/:versionId/submit': ['manager'],
  'POST /procedures/:id/versions/:versionId/return': ['manager'],
  'POST /procedures/:id/versions/:versionId/approve': ['manager'],
  'POST /procedures/:id/versions/:versionId/withdraw': ['manager'],
  'GET /procedures/:id/versions/:versionId/impact': ['manager'],
  'GET /procedures/:id/versions/:versionId/pdf': readers,
  'POST /procedures/:id/versions/:versionId/acknowledge': ['technician', 'assessor'],
  'GET /procedures/:id/acknowledgements': ['technician', 'assessor', 'manager', 'auditor'],
  'POST /procedures/:id/acknowledgements/:userId/extension': ['manager'],
};
