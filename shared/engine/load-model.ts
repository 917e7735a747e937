// Which loads the engine models; the others get a plain statement instead of a confident number.

export type LoadKind = 'resistive' | 'resistive-inductive' | 'universal-motor' | 'lamp-filament';

export interface LoadModel {
  kind: LoadKind;
  modelled: boolean;
  estimate: boolean;
  note: string;
}

/** Cold tungsten filament resistance is roughly 1/15 to 1/10 of hot (common practice, from memory). */
export const COLD_FILAMENT_RATIO = { min: 1 / 15, max: 1 / 10 } as const;

export function describeLoadModel(kind: LoadKind): LoadModel {
  switch (kind) {
    case 'resistive':
      return { kind, modelled: true, estimate: false, note: 'Fixed resistance (heater element).' };
    case 'resistive-inductive':
      return { kind, modelled: true, estimate: false, note: 'Series R-L with constant inductance (no saturation).' };
    case 'universal-motor':
      return {
        kind,
        modelled: false,
        estimate: true,
        note:
          'A universal motor generates a back-EMF that depends on speed and load torque; the engine does not model it. ' +
          'Figures computed as R-L are rough estimates only: measure on the bench.',
      };
    case 'lamp-filament':
      return {
        kind,
        modelled: false,
        estimate: true,
        note:
          'A cold filament has about 1/15 to 1/10 of its hot resistance, so switch-on current is many times the running current ' +
          'and resistance changes with the firing angle. Figures use the hot resistance and are estimates only.',
      };
  }
}

/** Peak switch-on current range of a cold filament fired at the supply peak (an estimate, not a rating). */
export function coldFilamentInrushA(supplyVrms: number, hotResistanceOhms: number): { minA: number; maxA: number } {
  const peak = Math.SQRT2 * supplyVrms;
  return {
    minA: peak / (hotResistanceOhms * COLD_FILAMENT_RATIO.max),
    maxA: peak / (hotResistanceOhms * COLD_FILAMENT_RATIO.min),
  };
}
