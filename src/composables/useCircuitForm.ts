import { computed, reactive } from 'vue';
import type { CircuitLoadKind } from '@shared/practicals/terms';
import type { CircuitInput } from '@/api/records';

/** The circuit as the assessor types it (kΩ, nF, mA), and as the API takes it (Ω, F, A). */
export function useCircuitForm() {
  const s = reactive({
    loadKind: 'resistance' as CircuitLoadKind, ohms: 529 as number | null, ratedPowerW: 100 as number | null, ratedVoltageV: 230 as number | null, inductanceMh: 50 as number | null,
    fixedK: 3.3 as number | null, potK: 470 as number | null, settingPct: 30 as number | null, capacitanceNf: 100 as number | null, breakoverV: 32 as number | null,
    breakbackV: 6 as number | null, latchingMa: 40 as number | null, holdingMa: 25 as number | null, gateMa: 25 as number | null, gateV: 1 as number | null,
    thermal: false, vt0: 1.1 as number | null, rt: 0.05 as number | null, rthJc: 3 as number | null, rthCs: 0.5 as number | null, rthSa: 20 as number | null,
    ambientC: 25 as number | null, maxJunctionC: 125 as number | null,
  });
  const scaled = (v: number | null, k: number) => (v === null ? (undefined as unknown as number) : v * k);
  const load = computed((): CircuitInput['load'] => {
    switch (s.loadKind) {
      case 'resistance':
        return { kind: 'resistance', ohms: scaled(s.ohms, 1) };
      case 'resistive-inductive':
        return { kind: 'resistive-inductive', resistanceOhms: scaled(s.ohms, 1), inductanceH: scaled(s.inductanceMh, 1e-3) };
      default:
        return { kind: s.loadKind, ratedPowerW: scaled(s.ratedPowerW, 1), ratedVoltageV: scaled(s.ratedVoltageV, 1) };
    }
  });
  const circuit = computed((): CircuitInput => ({
    load: load.value,
    trigger: {
      fixedResistanceOhms: scaled(s.fixedK, 1e3), potentiometerOhms: scaled(s.potK, 1e3), setting: scaled(s.settingPct, 0.01), capacitanceF: scaled(s.capacitanceNf, 1e-9),
      breakoverV: scaled(s.breakoverV, 1), breakbackV: scaled(s.breakbackV, 1), latchingCurrentA: scaled(s.latchingMa, 1e-3), holdingCurrentA: scaled(s.holdingMa, 1e-3),
      gateTriggerCurrentA: scaled(s.gateMa, 1e-3), gateTriggerVoltageV: scaled(s.gateV, 1),
    },
    thermal: s.thermal
      ? { thresholdVoltageV: scaled(s.vt0, 1), slopeResistanceOhms: scaled(s.rt, 1), rthJunctionCaseKW: scaled(s.rthJc, 1), rthCaseSinkKW: scaled(s.rthCs, 1), rthSinkAmbientKW: scaled(s.rthSa, 1), ambientC: scaled(s.ambientC, 1), maxJunctionC: scaled(s.maxJunctionC, 1) }
      : null,
  }));
  return { state: s, circuit };
}
