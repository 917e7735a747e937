// Steady-state thermal check of a thyristor or triac through a series chain of thermal resistances.

export interface ThermalParams {
  /** Threshold (knee) voltage V_T0, volts. */
  thresholdVoltageV: number;
  /** Slope resistance r_T, ohms. */
  slopeResistanceOhms: number;
  /** I_T(AV): for a triac use the full-cycle mean of |i|. */
  averageCurrentA: number;
  rmsCurrentA: number;
  rthJunctionCaseKW: number;
  rthCaseSinkKW: number;
  /** Heatsink to ambient; omit to only size the heatsink. */
  rthSinkAmbientKW?: number;
  ambientC: number;
  maxJunctionC: number;
}

export interface ThermalResult {
  conductionLossW: number;
  /** Null when no heatsink value was given. */
  junctionC: number | null;
  /** Case (mounting base) and heatsink temperatures: what a contact thermometer reads on the bench; null without a heatsink value. */
  caseC: number | null;
  sinkC: number | null;
  withinLimit: boolean | null;
  /** Largest heatsink-to-ambient resistance that keeps Tj ≤ Tj,max; null when none can (or no loss). */
  maxSinkAmbientKW: number | null;
  heatsinkPossible: boolean;
  statement: string;
}

export const conductionLoss = (vt0: number, rt: number, iav: number, irms: number): number =>
  vt0 * iav + rt * irms * irms;

export function thermalCheck(p: ThermalParams): ThermalResult {
  const loss = conductionLoss(p.thresholdVoltageV, p.slopeResistanceOhms, p.averageCurrentA, p.rmsCurrentA);
  const deviceChain = p.rthJunctionCaseKW + p.rthCaseSinkKW;
  const sa = p.rthSinkAmbientKW;
  // Temperature at a point of the chain: ambient plus the loss through everything between it and the air.
  const at = (above: number) => (sa === undefined ? null : p.ambientC + loss * (above + sa));
  const temps = { junctionC: at(deviceChain), caseC: at(p.rthCaseSinkKW), sinkC: at(0) };
  const { junctionC } = temps;
  const withinLimit = junctionC === null ? null : junctionC <= p.maxJunctionC;
  // No loss, or one so small that any heatsink at all would do (the division would overflow).
  if (loss === 0 || !Number.isFinite((p.maxJunctionC - p.ambientC) / loss)) {
    return { conductionLossW: loss, ...temps, withinLimit, maxSinkAmbientKW: null, heatsinkPossible: true, statement: 'No conduction loss: no heatsink is needed.' };
  }
  const rise = p.ambientC + loss * deviceChain;
  if (rise >= p.maxJunctionC) {
    return {
      conductionLossW: loss,
      ...temps,
      withinLimit,
      maxSinkAmbientKW: null,
      heatsinkPossible: false,
      statement: `No heatsink can keep the junction at or below ${p.maxJunctionC} °C: the device and interface alone reach ${rise.toFixed(1)} °C at ${loss.toFixed(2)} W.`,
    };
  }
  const maxSa = (p.maxJunctionC - p.ambientC) / loss - deviceChain;
  return {
    conductionLossW: loss,
    ...temps,
    withinLimit,
    maxSinkAmbientKW: maxSa,
    heatsinkPossible: true,
    statement: `A heatsink of at most ${maxSa.toFixed(2)} K/W (sink to ambient) keeps the junction at or below ${p.maxJunctionC} °C.`,
  };
}
