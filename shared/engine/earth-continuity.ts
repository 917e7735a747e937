// Earth continuity limit for an appliance lead: the lead's own protective-conductor resistance plus 0.1 Ω.
import type { LimitPreset } from './limits';

/** Copper at 20 °C, Ω·mm²/m (general reference value). */
export const COPPER_RESISTIVITY = 0.0172;

/** Per-metre protective-conductor resistances from the IET Code of Practice table, mΩ/m, from memory. */
export const LEAD_RESISTANCE_MOHM_PER_M: Readonly<Record<string, number>> = { '0.75': 26, '1': 19.5, '1.25': 16, '1.5': 13 };

/** The allowance the code of practice adds for the appliance's own protective conductor path. */
export const EARTH_ALLOWANCE_OHM = 0.1;

export function leadResistanceOhm(lengthM: number, csaMm2: number, method: 'table' | 'resistivity' = 'table'): number {
  const perMetre = LEAD_RESISTANCE_MOHM_PER_M[String(csaMm2)];
  if (method === 'table' && perMetre !== undefined) return (perMetre / 1000) * lengthM;
  return (COPPER_RESISTIVITY * lengthM) / csaMm2;
}

export function earthContinuityPreset(
  lengthM: number,
  csaMm2: number,
  method: 'table' | 'resistivity' = 'table',
): Extract<LimitPreset, { comparison: 'max' }> {
  const inTable = method === 'table' && String(csaMm2) in LEAD_RESISTANCE_MOHM_PER_M;
  const lead = leadResistanceOhm(lengthM, csaMm2, method);
  return {
    id: `earth-continuity-${lengthM}m-${csaMm2}mm2`,
    label: `Earth continuity, ${lengthM} m lead of ${csaMm2} mm²`,
    unit: 'Ω',
    comparison: 'max',
    value: EARTH_ALLOWANCE_OHM + lead,
    source: {
      standard: 'IET Code of Practice for In-service Inspection and Testing of Electrical Equipment',
      edition: '5th edition (2020), from memory',
      table: inTable ? 'Protective conductor resistance per metre of flexible cord (from memory)' : 'Computed from copper resistivity 0.0172 Ω·mm²/m at 20 °C',
    },
    note: `${EARTH_ALLOWANCE_OHM} Ω allowance plus ${lead.toFixed(3)} Ω for the lead.`,
  };
}
