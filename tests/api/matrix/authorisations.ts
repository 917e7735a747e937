import type { MatrixRows } from './types.js';

const everyone = ['technician', 'assessor', 'manager', 'auditor', 'admin'] as const;
const benchStaffAndManagers = ['technician', 'assessor', 'manager'] as const;

// Reads pass the access check for everyone: a technician's lists hold only their own records (see authorisations.test.ts).
export const rows: MatrixRows = {
  'GET /scopes': [...everyone],
  'GET /scopes/:id': [...everyone],
  'POST /scopes': ['manager'],
  'PUT /scopes/:id': ['manager'],
  'GET /authorisations/mine': [...everyone],
  'GET /authorisations/due': [...everyone],
  'POST /authorisations/prior': ['manager'],
  'POST /authorisations/import': ['manager'],
  'GET /authorisations/import/jobs/:id': ['manager'],
  'GET /authorisations': [...everyone],
  'GET /authorisations/:id': [...everyone],
  'GET /authorisations/:id/certificate': [...everyone],
  'POST /authorisations/:id/suspend': ['manager'],
  'POST /authorisations/:id/reinstate': ['manager'],
  'POST /authorisations/:id/revoke': ['manager'],
  'GET /eligibility/:personId': [...everyone],
  'GET /eligibility/:personId/:scopeId': [...everyone],
  'GET /certificates': [...everyone],
  'POST /certificates': [...benchStaffAndManagers],
  'POST /certificates/:id/verify': ['manager'],
  'POST /certificates/:id/reject': ['manager'],
  'GET /verify/:code': 'public',
  'POST /reminders/sweep': ['manager', 'admin'],
  'GET /reminders/sweep/:id': ['manager', 'auditor', 'admin'],
  'GET /reminders': ['manager', 'auditor', 'admin'],
};
