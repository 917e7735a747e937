import { afterEach, describe, expect, it, vi } from 'vitest';
import RecordMeasurementEntry from '@/components/RecordMeasurementEntry.vue';
import RecordAttempts from '@/components/RecordAttempts.vue';
import type { RecordItemView } from '@/api/records';
import { getByRole, mountWith, nameOf, queryAllByRole, settle, type, userWith } from './support';

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

const meter = { id: '30000000-0000-4000-8000-000000000001', label: 'Ohmwerk DM 61 SN OW61-20417' };
const attempt = (seq: number, value: number, verdict: 'pass' | 'fail', reason: string | null) => ({
  seq, value, didNotTrip: false, unit: 'V', instrument: meter.label, recordedAt: `2026-03-02T09:0${seq}:00.000Z`, recordedByName: 'Priya Natarajan', verdict, expected: 190.16, tolerance: '± 5 %', reason,
});
const item: RecordItemView = {
  id: '20000000-0000-4000-8000-000000000001', position: 2, kind: 'measurement', prompt: 'Output RMS voltage', guidance: null, unit: 'V',
  rule: { type: 'computed', quantity: 'output-rms-voltage', tolerance: { mode: 'relative', percent: 5 } }, stepKey: null,
  ruleText: 'Output RMS voltage computed from the bench set-up, ± 5 %', expected: 190.16, tolerance: '± 5 % (± 9.508 V)', noExpectation: false, problem: 'the reading is outside the acceptance rule',
  entry: { checked: null, text: null, evidenceId: null, value: 150, didNotTrip: false, unit: 'V', instrument: meter, verdict: 'fail', judgedBy: 'rule', expected: 190.16, tolerance: '± 5 %', ruleText: null, source: null, note: null, recordedAt: '2026-03-02T09:01:00.000Z', recordedByName: 'Priya Natarajan', seq: 1 },
  attempts: [attempt(1, 150, 'fail', null)],
};

describe('readings taken again at the bench', () => {
  it('when a practical reading is taken again, then a reason field shows and the reason goes out with the reading', async () => {
    const { wrapper } = await mountWith(RecordMeasurementEntry, { user: userWith(['assessor']), props: { item, editable: true, assessing: true, busy: false, errors: {}, instruments: [meter], quantities: { 'output-rms-voltage': 190.16 } } });
    await type(document.querySelector<HTMLInputElement>('input[inputmode="decimal"]')!, '188,4');
    await type(getByRole('textbox', 'Why is the reading taken again?'), 'Potentiometer reset to the mid mark.');
    queryAllByRole('button', 'Record the reading')[0].click();
    await settle();
    expect(wrapper.findComponent(RecordMeasurementEntry).emitted('save')?.[0]).toEqual([{ value: 188.4, unit: 'V', instrumentId: meter.id, reason: 'Potentiometer reset to the mid mark.' }]);
  });

  it('when an item has more than one reading, then each shows in order with value, instrument, verdict and reason', async () => {
    await mountWith(RecordAttempts, { user: userWith(['assessor']), props: { prompt: 'Output RMS voltage', attempts: [attempt(1, 150, 'fail', null), attempt(3, 188.4, 'pass', 'Potentiometer reset to the mid mark.')] } });
    const list = [...document.querySelectorAll('section')].find((s) => nameOf(s) === 'Every reading: Output RMS voltage')!;
    const lines = [...list.querySelectorAll('li')].map((li) => li.textContent!.replace(/\s+/g, ' ').trim());
    expect(lines[0]).toMatch(/^No\. 1: 150 V with Ohmwerk DM 61 SN OW61-20417, .+, Priya Natarajan: failed$/);
    expect(lines[1]).toMatch(/^No\. 3: 188\.4 V with Ohmwerk DM 61 SN OW61-20417, .+, Priya Natarajan: passed · taken again because: Potentiometer reset to the mid mark\.$/);
  });
});
