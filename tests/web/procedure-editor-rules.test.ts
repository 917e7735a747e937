import { afterEach, describe, expect, it, vi } from 'vitest';
import ProcedureEditView from '@/views/ProcedureEditView.vue';
import { fakeFetch, getByRole, messagesBeside, mountWith, nameOf, settle, type, userWith } from './support';

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

const P = '30000000-0000-4000-8000-000000000001';
const V2 = '30000000-0000-4000-8000-000000000012';
const K = (n: number) => `40000000-0000-4000-8000-00000000000${n}`;
const computedItem = {
  id: null, key: K(6), kind: 'measurement', prompt: 'Output RMS voltage', guidance: null, unit: 'V', ruleText: null, stepKey: null,
  rule: { type: 'computed', quantity: 'output-rms-voltage', tolerance: { mode: 'relative', percent: 5 } },
};
const version = {
  id: V2, procedureId: P, code: 'BO-T-01', number: 2, status: 'draft', inForce: false, title: 'Triac repair', category: 'dead-work', reviewPeriodMonths: 12,
  scope: 'Bench repair.', hazards: [], ppe: [], equipment: [], steps: [],
  checklists: [{ id: null, key: K(5), kind: 'self-sign-off', title: 'Technician sign-off', items: [computedItem] }],
  changeClass: 'editorial', changeSummary: 'Wording', rereadDays: 14, author: { id: 'a', name: 'Jörg Łukasik' }, editors: [],
  basedOn: null, changeCheck: null, createdAt: '2026-03-01T09:00:00.000Z', updatedAt: '2026-03-01T09:00:00.000Z',
  submittedAt: null, returned: null, approval: null, publishedAt: null, reviewDueOn: null, reviewOverdue: false, supersededAt: null, withdrawn: null,
  siteTimeZone: 'Europe/Berlin', myAcknowledgement: null,
};
const REASON = 'a computed value needs the circuit under test, which only a practical has; use a fixed range or a published limit, or leave it to the assessor';

describe('a computed-value rule outside a practical in the editor', () => {
  it('when the server refuses the rule of a self sign-off item, then its reason shows beside that item’s rule', async () => {
    fakeFetch((c) => {
      if (c.method === 'GET' && c.url.pathname === `/api/procedures/${P}/versions/${V2}`) return { body: version };
      if (c.method === 'PUT') return { status: 422, body: { error: { code: 'unprocessable', message: `checklists.0.items.0.rule: ${REASON}`, fields: { 'checklists.0.items.0.rule': REASON } } } };
      return undefined;
    });
    await mountWith(ProcedureEditView, { user: userWith(['manager']), path: `/procedures/${P}/versions/${V2}/edit` });
    const inputNamed = (n: string) => [...document.querySelectorAll<HTMLElement>('input, textarea')].find((el) => nameOf(el) === n)!;
    const ruleSelect = () => inputNamed('Acceptance rule');
    expect(messagesBeside(ruleSelect())).toBe('');
    await type(inputNamed('Change summary'), 'Output voltage item added.');
    getByRole('button', 'Save the draft').click();
    await settle();
    expect(messagesBeside(ruleSelect())).toBe(REASON);
  });
});
