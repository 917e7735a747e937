// What a checklist measurement can be compared against when the engine computes the expected value
// from a practical's bench set-up (supply, load, trigger network). The practical supplies the figures.

export const COMPUTED_QUANTITY_IDS = [
  'firing-angle', 'conduction-angle', 'delay-time', 'output-rms-voltage', 'load-rms-current', 'load-power',
  'case-temperature', 'heatsink-temperature',
] as const;
export type ComputedQuantity = (typeof COMPUTED_QUANTITY_IDS)[number];

export const COMPUTED_QUANTITIES: Record<ComputedQuantity, { label: string; unit: string; note: string }> = {
  'firing-angle': { label: 'Firing angle α', unit: '°', note: 'From the time-domain simulation of the RC–diac trigger (the authority; the estimate is not used).' },
  'conduction-angle': { label: 'Conduction angle', unit: '°', note: '180° − α for a resistive load.' },
  'delay-time': { label: 'Delay after the zero crossing', unit: 'ms', note: 'α over the angular frequency of the supply.' },
  'output-rms-voltage': { label: 'Output RMS voltage', unit: 'V', note: 'V·√(1 − α/π + sin 2α / 2π), resistive load.' },
  'load-rms-current': { label: 'RMS load current', unit: 'A', note: 'Output RMS voltage over the load resistance.' },
  'load-power': { label: 'Load power', unit: 'W', note: 'Output RMS voltage squared over the load resistance.' },
  'case-temperature': {
    label: 'Device case temperature', unit: '°C',
    note: 'Steady state, once the heatsink has settled: ambient plus the conduction loss times the case-to-sink and sink-to-ambient resistances. Needs the device thermal figures with a heatsink value.',
  },
  'heatsink-temperature': {
    label: 'Heatsink temperature', unit: '°C',
    note: 'Steady state, once the heatsink has settled: ambient plus the conduction loss times the sink-to-ambient resistance. Needs the device thermal figures with a heatsink value.',
  },
};
