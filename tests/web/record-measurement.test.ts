import { afterEach, describe, expect, it, vi } from 'vitest';
import RecordMeasurementEntry from '@/components/RecordMeasurementEntry.vue';
import type { RecordItemView } from '@/api/records';
import { mountWith, queryAllByRole, settle, type, userWith } from './support';

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

// Expected output 190.2 V ± 5 %: the band is ± 9.508 V (common practice: a relative tolerance of the expected value).
const item: RecordItemView = {
  id: '20000000-0000-4000-8000-000000000001', position: 2, kind: 'measurement', prompt: 'Output RMS voltage', guidance: null, unit: 'V',
  rule: { type: 'computed', quantity: 'output-rms-voltage', tolerance: { mode: 'relative', percent: 5 } }, stepKey: null,
  ruleText: 'Output RMS voltage computed from the bench set-up, ± 5 %', expected: 190.16, tolerance: '± 5 % (± 9.508 V)', noExpectation: false, entry: null, problem: 'not measured',
};
const quantities = { 'output-rms-voltage': 190.16 };
const meter = { id: '30000000-0000-4000-8000-000000000001', label: 'Ohmwerk DM 61 SN OW61-20417' };

async function mountEntry(props: Partial<Record<string, unknown>> = {}) {
  return mountWith(RecordMeasurementEntry, { user: userWith(['assessor']), props: { item, editable: true, assessing: true, busy: false, errors: {}, instruments: [meter], quantities, ...props } });
}
const reading = () => document.querySelector<HTMLInputElement>('input[inputmode="decimal"]')!;
const verdict = () => document.querySelector('[data-testid="verdict"]')?.textContent?.trim() ?? '';

describe('a measurement at the bench', () => {
  it('when nothing is typed yet, then the expected value and its tolerance stand beside the entry on a decimal keypad', async () => {
    await mountEntry();
    expect(reading()).not.toBeNull();
    expect(document.querySelector('[data-testid="expected"]')?.textContent?.trim()).toBe('Expected 190.2 V');
    expect(document.querySelector('[data-testid="tolerance"]')?.textContent?.trim()).toBe('± 5 % (± 9.508 V)');
    expect(verdict()).toBe('');
  });

  it('when a reading outside the band is typed with a decimal comma, then the preview says it would fail; inside, that it would pass', async () => {
    await mountEntry();
    await type(reading(), '175,5');
    expect(verdict()).toBe('If recorded: outside the rule: failed');
    await type(reading(), '199,6');
    expect(verdict()).toBe('If recorded: within the rule: passed');
  });

  it('when a recorded reading is shown, then its stored verdict and instrument stand beside it, and a new reading goes out with unit and instrument', async () => {
    const entry = { value: 150, unit: 'V', didNotTrip: false, verdict: 'fail', judgedBy: 'rule', instrument: meter, expected: 190.16, tolerance: '± 5 % (± 9.508 V)' };
    const { wrapper } = await mountEntry({ item: { ...item, entry, problem: 'the reading is outside the acceptance rule' } });
    expect(verdict()).toBe('Outside the rule: failed');
    expect(document.body.textContent).toContain('Recorded 150 V with Ohmwerk DM 61 SN OW61-20417');
    await type(reading(), '188,4');
    queryAllByRole('button', 'Record the reading')[0].click();
    await settle();
    expect(wrapper.findComponent(RecordMeasurementEntry).emitted('save')?.[0]).toEqual([{ value: 188.4, unit: 'V', instrumentId: meter.id, assessorVerdict: undefined }]);
  });
});
