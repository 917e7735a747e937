import type { SeedProcedure, SeedStep, SeedVersion } from './types.js';

// Dead work on a bench supply: isolate, secure, prove dead. Invented for the demo in the workshop's own words.
const base = {
  title: 'Isolating and proving dead a bench power supply',
  scope:
    'Any work inside a mains-powered bench supply, lamp controller or motor controller on the repair bench where the case is opened or ' +
    'internal parts are touched. The unit is worked on dead. This procedure does not cover live testing (see BO-LIVE-02) and does not ' +
    "replace the site's isolation rules or the electrician's lock-off procedure for fixed installations.",
  hazards: [
    'Electric shock from mains voltage if the unit is reconnected or was never isolated',
    'Stored charge in smoothing and suppression capacitors after the plug is removed',
    'A second supply (battery back-up, external DC input, a second mains lead) keeping parts live',
    'Burns from heatsinks and resistors that were running before isolation',
  ],
  ppe: ['Safety glasses while discharging capacitors and desoldering'],
  equipment: [
    'Two-pole voltage tester to EN 61243-3 (or the local equivalent), not a single-pole screwdriver tester',
    'Proving unit, or a known live source at the bench, to check the tester before and after',
    'Discharge tool with a series resistor rated for the capacitor voltage',
    'Personal padlock and "Do not connect" tag for the plug or bench isolator',
  ],
};

const steps: SeedStep[] = [
  { id: 'identify', text: 'Identify every supply to the unit: mains lead, any second lead, batteries, external DC inputs and signal cables that can carry voltage.' },
  { id: 'switch-off', text: 'Switch the unit off at its own switch, then remove the plug from the socket (or switch off and lock the bench isolator).' },
  { id: 'secure', text: 'Secure the isolation: fit your own padlock to the plug lock-off or isolator and hang the tag with your name and the date. Keep the key on you.', caution: 'Nobody else removes your lock. If the key is lost, the manager follows the site rule for removing a lock.' },
  { id: 'wait', text: 'Wait for the discharge time on the label or in the service manual (at least 5 minutes if none is given) before opening the case.' },
  { id: 'open', text: 'Open the case. Look for the large capacitors, the bleed resistors and any sign of damage, burning or a swollen capacitor before you touch anything.' },
  { id: 'prove', text: 'Prove dead: check the tester on the proving unit, test between every pair of supply conductors and from each to protective earth at the input terminals and across the main capacitors, then check the tester on the proving unit again.', holdPoint: true, caution: 'If any test shows voltage, stop. Do not work on the unit; tell your supervisor. A tester that fails its second check means every reading in between is void.' },
  { id: 'discharge', text: 'Discharge any capacitor still above 50 V through the discharge tool, hold it for at least 5 seconds and prove dead again across the capacitor.' },
  { id: 'work', text: 'Carry out the repair. If you leave the bench, the lock stays on and the case stays marked as open.' },
  { id: 'restore', text: 'When the work is done: close the case, do the insulation resistance and earth continuity checks on the checklist, then remove your own lock and tag and reconnect.' },
];

const checklists: SeedVersion['checklists'] = [
  {
    kind: 'self-sign-off',
    title: 'Dead-work sign-off',
    items: [
      { step: 'switch-off', kind: 'tick', prompt: 'I found and isolated every supply to the unit, including second leads and batteries.' },
      { step: 'secure', kind: 'tick', prompt: 'My own lock and tag were on the plug or isolator for the whole job.' },
      { step: 'prove', kind: 'tick', prompt: 'I checked the tester on the proving unit before and after proving dead.' },
      { step: 'prove', kind: 'text', prompt: 'Serial number of the two-pole tester used' },
      { step: 'restore', kind: 'measurement', prompt: 'Insulation resistance after the repair, live conductors joined to the metal case (500 V DC)', unit: 'MΩ', rule: { type: 'preset', presetId: 'insulation-equipment-class-i' } },
      { step: 'restore', kind: 'measurement', prompt: 'Earth continuity from the plug earth pin to the metal case (2 m lead, 1.0 mm²)', unit: 'Ω', rule: { type: 'earth-continuity', lengthM: 2, csaMm2: 1 } },
    ],
  },
  {
    kind: 'practical-assessment',
    title: 'Supervised isolation, assessor record',
    items: [
      { step: 'identify', kind: 'tick', prompt: 'Identified all supplies without prompting, including the second input on the demonstration unit.' },
      { step: 'prove', kind: 'tick', prompt: 'Proved dead in the right order (prove, test, prove) and between all conductor pairs.' },
      { step: 'discharge', kind: 'tick', prompt: 'Stopped and reported when the prepared fault (residual charge) was shown.' },
      { step: 'secure', kind: 'evidence', prompt: 'Photo of the lock and tag as fitted' },
      { step: 'work', kind: 'text', prompt: 'What the technician did well and what to practise' },
    ],
  },
];

// Version 1 had no closing step and did not say how long to hold the discharge tool.
const v1Steps = steps
  .filter((s) => s.id !== 'restore')
  .map((s) => (s.id === 'discharge' ? { ...s, text: 'Discharge any capacitor still above 50 V through the discharge tool and prove dead again across it.' } : s));
const v1: SeedVersion = { ...base, steps: v1Steps, checklists, publishedDaysAgo: 400 };
const v2: SeedVersion = {
  ...base,
  steps,
  checklists,
  rereadDays: 30,
  change: { changeClass: 're-read', summary: 'Step 7 now says to hold the discharge tool for at least 5 seconds; new step 9 lists the checks before the unit is reconnected.' },
  publishedDaysAgo: 20,
};

export const isolation: SeedProcedure = {
  code: 'BO-ISO-01', site: 'LEJ-W1', category: 'dead-work', reviewPeriodMonths: 12,
  author: 'manager@demo.breakover.test', approver: 'manager2@demo.breakover.test',
  versions: [v1, v2],
  acknowledgements: [
    { email: 'technician@demo.breakover.test', version: 1 },
    { email: 'technician2@demo.breakover.test', version: 1 },
    { email: 'technician2@demo.breakover.test', version: 2 },
    { email: 'assessor@demo.breakover.test', version: 2 },
  ],
};
