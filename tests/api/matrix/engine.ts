import type { MatrixRows } from './types.js';

// The calculator is pure computation with nothing stored: every signed-in role may use it.
export const rows: MatrixRows = {
  'POST /engine/resistive': 'signed-in',
  'POST /engine/inverse': 'signed-in',
  'POST /engine/inductive': 'signed-in',
  'POST /engine/trigger': 'signed-in',
  'POST /engine/thermal': 'signed-in',
  'POST /engine/ratings': 'signed-in',
  'POST /engine/limit-check': 'signed-in',
  'POST /engine/earth-continuity': 'signed-in',
  'GET /engine/limit-presets': 'signed-in',
};
