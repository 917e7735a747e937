import { randomUUID } from 'node:crypto';
import { recordsDraft } from './records.js';

/**
 * The records procedure with its assessor checklist linked to steps: hold point 1 is step 2 ("connections
 * checked before switch-on"), the readings belong to step 3.
 */
export function linkedProcedure() {
  const keys = { connect: randomUUID(), check: randomUUID(), measure: randomUUID(), off: randomUUID() };
  const draft = () => {
    const base = recordsDraft();
    const steps = [
      { key: keys.connect, text: 'Connect the unit under test to the isolating transformer output, supply off.', holdPoint: false },
      { key: keys.check, text: 'Connections checked before switch-on.', holdPoint: true },
      { key: keys.measure, text: 'Switch on and measure the output with the meter and the differential probe.', caution: 'Hands clear of the output while energised.', holdPoint: false },
      { key: keys.off, text: 'Switch off, isolate and prove dead before disconnecting.', holdPoint: true },
    ];
    const stepOf: Record<string, string> = { 'The technician proved dead': keys.connect, 'Bench RCD': keys.check, 'Firing angle': keys.measure, 'Output RMS voltage': keys.measure };
    const checklists = base.checklists!.map((c) => ({ ...c, items: c.items.map((i) => ({ ...i, stepKey: Object.entries(stepOf).find(([p]) => i.prompt.startsWith(p))?.[1] ?? null })) }));
    return { ...base, steps, checklists };
  };
  return { keys, draft };
}
