import type { SeedProcedure } from './types.js';

// A draft waiting for review, so the demo shows the four-eyes step: Dana wrote it, Jörg may approve it.
export const heaterDraft: SeedProcedure = {
  code: 'BO-HTR-04', site: 'CLE-L2', category: 'commissioning', reviewPeriodMonths: 24,
  author: 'manager2@demo.breakover.test', approver: 'manager@demo.breakover.test',
  acknowledgements: [],
  versions: [{
    title: 'Commissioning a phase-angle heater regulator on a resistive load',
    scope:
      'First power-up of a triac heater regulator (120 V, resistive heating element up to 1.2 kW) on the heater regulator bench. The element ' +
      'is a fixed resistance when hot, so the engine\'s expected values apply. Live steps are measurements only, by a qualified person.',
    hazards: [
      'Electric shock at 120 V at the output terminals',
      'Burns from the heating element and the regulator heatsink',
      'Fire if the element is run unattended or near combustible material',
    ],
    ppe: ['Safety glasses', 'Heat-resistant gloves for handling the element after the test'],
    equipment: ['Isolating transformer rated 1.5 kVA', 'Bench GFCI (Class A)', 'True-RMS multimeter CAT III 300 V', 'Clamp meter', 'Fire extinguisher for electrical fires within reach'],
    steps: [
      { id: 'dead', text: 'Dead checks: insulation resistance of the element to its sheath, earth continuity of the sheath, regulator visually inspected.' },
      { id: 'mount', text: 'Mount the element on its ceramic stand away from anything that can burn; connect it and the meter with the supply off.' },
      { id: 'check', text: 'Supervisor check of the set-up before energising.', holdPoint: true },
      { id: 'measure', text: 'Energise at the minimum setting; raise to the mid mark; read output RMS voltage and load current; switch off.', caution: 'Never leave the element energised unattended, even for a moment.' },
    ].map((s) => ({ ...s, id: `htr-${s.id}` })),
    checklists: [{
      kind: 'practical-assessment',
      title: 'Heater regulator commissioning, supervised practical',
      items: [
        { step: 'measure', kind: 'measurement', prompt: 'RMS load current at the mid setting', unit: 'A', rule: { type: 'computed', quantity: 'load-rms-current', tolerance: { mode: 'relative', percent: 10 } } },
        { step: 'measure', kind: 'measurement', prompt: 'Output RMS voltage at the mid setting', unit: 'V', rule: { type: 'computed', quantity: 'output-rms-voltage', tolerance: { mode: 'relative', percent: 8 } } },
        { step: 'measure', kind: 'tick', prompt: 'Element never left energised unattended' },
      ],
    }],
  }],
};
