import type { LimitPreset } from '@shared/engine/limits';
import { api } from './client';

export interface LimitPresetCatalogue {
  presets: LimitPreset[];
  earthContinuity: { allowanceOhm: number; leadMilliohmPerMetre: Record<string, number>; copperResistivityOhmMm2PerM: number; note: string };
}

export const engineApi = {
  limitPresets: () => api.get<LimitPresetCatalogue>('/engine/limit-presets'),
};
