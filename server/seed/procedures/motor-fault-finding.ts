import type { SeedProcedure } from './types.js';

// Live fault-finding on a universal-motor speed controller at a 120 V site. Invented for the demo.
export const motorFaultFinding: SeedProcedure = {
  code: 'BO-FF-03', site: 'CLE-L2', category: 'live-fault-finding', reviewPeriodMonths: 12,
  author: 'manager2@demo.breakover.test', approver: 'manager@demo.breakover.test',
  acknowledgements: [{ email: 'technician3@demo.breakover.test', version: 1 }],
  versions: [{
    title: 'Fault-finding a universal-motor speed controller under power',
    // Published over a year ago with a 12-month review: the demo shows it as overdue for review.
    publishedDaysAgo: 380,
    scope:
      'Finding a fault in a triac speed controller for a universal motor (drills, mixers, small fans; 120 V, up to 6 A) when dead tests ' +
      'have not found it. Live fault-finding is the exception: it is done only by a qualified person holding the live fault-finding ' +
      'authorisation, with a second person present, and only where the organisation\'s rules and the local electrical safety rules allow it.',
    hazards: [
      'Electric shock at 120 V from exposed terminals inside the open controller',
      'Rotating armature and fan; loose clothing or leads caught in the motor',
      'Inductive kick and arcing when the motor circuit is broken under load',
      'Stored charge in the snubber and suppression capacitors after switch-off',
      'The engine does not model a universal motor: there are no computed expected values for this load, only measured limits',
    ],
    ppe: ['Safety glasses', 'Insulating gloves (class 00) with leather protectors when placing probes near live parts', 'No rings, watch or loose sleeves'],
    equipment: [
      'Isolating transformer rated for the motor starting current',
      'Bench GFCI (Class A) or 30 mA Type A RCD, tested before the session',
      'Multimeter rated CAT III 300 V or better with fused leads, shrouded probes and clip-on tips',
      'Clamp meter for the motor current',
      'Differential probe for any oscilloscope measurement',
      'Motor fixture with a guard over the rotating parts',
    ],
    steps: [
      { id: 'dead-first', text: 'Do every dead test first: resistance of the armature and field, the triac (gate-cathode and main terminals), the potentiometer and the RC network, and insulation resistance to the frame.' },
      { id: 'justify', text: 'Write down why live testing is needed (which dead tests were done and why they could not find the fault) and which measurements you will take.', holdPoint: true, caution: 'If you cannot say which measurement you need and why, do not go live.' },
      { id: 'area', text: 'Set up the test area: barrier and sign, motor clamped in its fixture with the guard on, a second person present who knows how to switch off and how to call for help.' },
      { id: 'supply', text: 'Feed the controller through the isolating transformer from the GFCI-protected bench outlet. Press the GFCI test button; it must trip. Reset it.' },
      { id: 'clips', text: 'With the supply off and proved dead, attach clip-on probes at the points you need. Set the controller to minimum speed.', caution: 'Never attach or move a probe while energised. Switch off, prove dead, move the clip, then energise again.' },
      { id: 'run', text: 'Energise, hands clear. Read supply voltage, output voltage and motor current at minimum, middle and maximum settings. Switch off between changes of probe position.' },
      { id: 'gate', text: 'If the triac does not fire, look at the gate drive with the differential probe and record a capture; compare with a known good unit if one is available.' },
      { id: 'finish', text: 'Switch off, wait at least 30 seconds, prove dead at the controller terminals, remove the probes and carry out the repair as dead work (BO-ISO-01).' },
    ].map((s) => ({ ...s, id: `ff-${s.id}` })),
    checklists: [
      {
        kind: 'practical-assessment',
        title: 'Live fault-finding, supervised practical',
        items: [
          { step: 'dead-first', kind: 'tick', prompt: 'Completed and recorded the dead tests before asking to go live' },
          { step: 'justify', kind: 'text', prompt: 'The reason given for live testing, in the technician\'s words' },
          { step: 'supply', kind: 'measurement', prompt: 'GFCI trip current measured with the tester', unit: 'mA', rule: { type: 'preset', presetId: 'gfci-class-a-trip-current' } },
          { step: 'run', kind: 'measurement', prompt: 'Supply voltage at the controller input', unit: 'V', rule: { type: 'range', min: 108, max: 132 } },
          { step: 'run', kind: 'measurement', prompt: 'Motor current at maximum setting, no load on the shaft', unit: 'A', rule: { type: 'range', max: 6 } },
          { step: 'gate', kind: 'evidence', prompt: 'Oscilloscope capture of the gate drive, or a photo of the meter readings' },
          { step: 'run', kind: 'tick', prompt: 'Did not move a probe while the unit was energised' },
        ],
      },
      {
        kind: 'self-sign-off',
        title: 'Technician sign-off',
        items: [
          { step: 'area', kind: 'tick', prompt: 'A second person was present for every live step.' },
          { step: 'finish', kind: 'text', prompt: 'Fault found and repair made' },
        ],
      },
    ],
  }],
};
