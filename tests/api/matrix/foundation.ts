import type { MatrixRows } from './types.js';

const everyone = ['technician', 'assessor', 'manager', 'auditor', 'admin'] as const;

export const rows: MatrixRows = {
  'GET /health': 'public',
  'GET /live': 'public',
  'POST /session': 'public',
  'GET /session': 'signed-in',
  'DELETE /session': 'public',
  'PUT /session/password': 'signed-in',
  'GET /password/link': 'public',
  'POST /password/set': 'public',
  'POST /password/forgot': 'public',
  // Everyone may list people: a technician's list holds only themselves (see people.test.ts).
  'GET /people': [...everyone],
  'POST /people': ['manager', 'admin'],
  'GET /people/:id': [...everyone],
  'PATCH /people/:id': [...everyone],
  'POST /people/:id/invitation': ['manager', 'admin'],
  'DELETE /people/:id/sessions': ['admin'],
  'GET /sites': [...everyone],
  'POST /sites': ['admin'],
  'PATCH /sites/:id': ['admin'],
  'GET /mail': ['admin'],
  'GET /mail/:id': ['admin'],
  'POST /mail/:id/retry': ['admin'],
};
