import type { SeedProcedure } from './types.js';

// Live commissioning of a phase-angle lamp controller: the live part is limited to measurements with the
// set-up fixed beforehand, behind an isolating transformer and a 30 mA Type A RCD. Invented for the demo.
export const liveCommissioning: SeedProcedure = {
  code: 'BO-LIVE-02', site: 'LEJ-W1', category: 'commissioning', reviewPeriodMonths: 12,
  author: 'manager@demo.breakover.test', approver: 'manager2@demo.breakover.test',
  acknowledgements: [
    { email: 'technician@demo.breakover.test', version: 1 },
    { email: 'assessor@demo.breakover.test', version: 1 },
  ],
  versions: [{
    title: 'Live commissioning of a phase-angle lamp controller behind an isolating transformer and RCD',
    publishedDaysAgo: 90,
    scope:
      'First power-up and adjustment of a repaired or newly built triac lamp controller (230 V, resistive lamp load up to 300 W) on a bench fed ' +
      'through an isolating transformer, with a 30 mA Type A (or better) RCD ahead of the bench. Live work is limited to measurements and the ' +
      'adjustment of the control; nothing is connected, disconnected or soldered while the unit is energised. Only a skilled person holding ' +
      'the live-testing authorisation does the live steps, or an instructed person under their direct supervision during assessment.',
    hazards: [
      'Electric shock between the two output conductors: the isolating transformer removes the earth path, not the voltage between its own terminals',
      'An RCD ahead of the transformer does not see a fault on the secondary side',
      'An earthed oscilloscope ground clip on the circuit defeats the isolation and can short the controller',
      'Lamp bulb failure at switch-on (hot glass); heatsink temperatures above 70 °C',
      'Arc flash from a short circuit at the output if a probe slips',
    ],
    ppe: ['Safety glasses', 'Insulating gloves (class 00) for attaching clips when the set-up requires it'],
    equipment: [
      'Isolating transformer rated for the lamp load plus margin, with its rating plate checked',
      '30 mA Type A RCD at the bench, tested with its test button before the session',
      'True-RMS multimeter rated CAT II 600 V or better, with shrouded leads and clip-on probes',
      'Oscilloscope with a differential probe rated for the voltage (never a floating oscilloscope)',
      'Insulation resistance tester (500 V DC) and low-resistance ohmmeter for earth continuity',
      'Barrier and "Live testing in progress" sign for the test area',
    ],
    steps: [
      { id: 'justify', text: 'Confirm the live steps are needed: the unit has already passed its dead checks (insulation resistance, earth continuity, visual inspection) and the adjustment cannot be made dead.' },
      { id: 'area', text: 'Set up the test area: barrier in place, sign displayed, bench clear of loose metal and tools, emergency stop within reach and tested.' },
      { id: 'rcd', text: 'Press the test button of the bench RCD; it must trip. Reset it. Record the last instrument test of the RCD from the bench log.', caution: 'The RCD protects faults to earth on the bench supply only. Behind the isolating transformer it will not trip if you touch both output conductors.' },
      { id: 'connect', text: 'With everything dead: connect the lamp load, attach the meter and differential probe clips to the output terminals, set the control to its minimum and route the leads so nothing can be pulled off.' },
      { id: 'check', text: 'Supervisor check of the set-up before first energising: transformer in circuit, scope probe differential, clips secure, hands clear.', holdPoint: true },
      { id: 'energise', text: 'Energise from the bench switch, hands off. Watch the lamp and the controller for 30 seconds: no smoke, smell, buzzing or flicker.' },
      { id: 'sweep', text: 'Turn the control slowly from minimum to maximum and back. The lamp must follow smoothly with no snap-on and no flicker at low settings.', caution: 'Use the insulated control knob only. Do not touch the case, the heatsink or any screw while energised.' },
      { id: 'measure', text: 'Set the control to the mid mark. Read the output RMS voltage on the meter and the firing angle α on the oscilloscope; record both on the checklist.' },
      { id: 'off', text: 'Switch off at the bench switch, wait for the lamp to cool, and prove dead at the output before removing any clip.' },
    ].map((s) => ({ ...s, id: `live-${s.id}` })),
    checklists: [
      {
        kind: 'bench-pre-use',
        title: 'Bench check before live commissioning',
        items: [
          { step: 'area', kind: 'tick', prompt: 'Isolating transformer in circuit and its rating covers the load' },
          { step: 'rcd', kind: 'tick', prompt: 'RCD test button tripped the device' },
          { step: 'rcd', kind: 'measurement', prompt: 'RCD break time at 1×IΔn (30 mA) from the last instrument test', unit: 'ms', rule: { type: 'preset', presetId: 'rcd-30ma-1x' } },
          { step: 'rcd', kind: 'measurement', prompt: 'RCD break time at 5×IΔn (150 mA) from the last instrument test', unit: 'ms', rule: { type: 'preset', presetId: 'rcd-30ma-5x' } },
          { step: 'area', kind: 'measurement', prompt: 'Supply voltage at the bench socket', unit: 'V', rule: { type: 'range', min: 207, max: 253 } },
        ],
      },
      {
        kind: 'practical-assessment',
        title: 'Live commissioning, supervised practical',
        items: [
          { step: 'justify', kind: 'tick', prompt: 'Dead checks done and recorded before any live step' },
          { step: 'check', kind: 'tick', prompt: 'Waited at the hold point for the supervisor check' },
          { step: 'justify', kind: 'measurement', prompt: 'Insulation resistance, live conductors joined to the case (500 V DC)', unit: 'MΩ', rule: { type: 'preset', presetId: 'insulation-equipment-class-i' } },
          { step: 'measure', kind: 'measurement', prompt: 'Output RMS voltage at the mid setting', unit: 'V', rule: { type: 'computed', quantity: 'output-rms-voltage', tolerance: { mode: 'relative', percent: 8 } } },
          { step: 'measure', kind: 'measurement', prompt: 'Firing angle α at the mid setting, read on the oscilloscope', unit: '°', rule: { type: 'computed', quantity: 'firing-angle', tolerance: { mode: 'absolute', value: 10 } } },
          { step: 'measure', kind: 'evidence', prompt: 'Oscilloscope capture of the phase-cut output at the mid setting' },
          { step: 'off', kind: 'text', prompt: 'Assessor remarks: safe habits seen, anything to correct' },
        ],
      },
      {
        kind: 'self-sign-off',
        title: 'Technician sign-off',
        items: [
          { step: 'sweep', kind: 'tick', prompt: 'I made no connection or disconnection while the unit was energised.' },
          { step: 'off', kind: 'tick', prompt: 'I proved dead at the output before removing the clips.' },
        ],
      },
    ],
  }],
};
