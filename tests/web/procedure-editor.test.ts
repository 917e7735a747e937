import { afterEach, describe, expect, it, vi } from 'vitest';
import ProcedureEditView from '@/views/ProcedureEditView.vue';
import { fakeFetch, getByRole, messagesBeside, mountWith, settle, type, userWith, type Call } from './support';

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

const P = '30000000-0000-4000-8000-000000000001';
const V1 = '30000000-0000-4000-8000-000000000011';
const V2 = '30000000-0000-4000-8000-000000000012';
const K = (n: number) => `40000000-0000-4000-8000-00000000000${n}`;
const steps = [
  { key: K(1), text: 'Unplug the unit.', caution: null, holdPoint: false },
  { key: K(2), text: 'Prove dead with the two-pole tester.', caution: 'Check the tester before and after.', holdPoint: true },
];
const version = (id: string, number: number, status: string) => ({
  id, procedureId: P, code: 'BO-T-01', number, status, inForce: status === 'published', title: 'Triac repair', category: 'dead-work', reviewPeriodMonths: 12,
  scope: 'Bench repair.', hazards: ['Stored charge'], ppe: [], equipment: [], steps, checklists: [
    { id: null, key: K(5), kind: 'self-sign-off', title: 'Sign-off', items: [{ id: null, key: K(6), kind: 'tick', prompt: 'Tester proved', guidance: null, unit: null, rule: null, ruleText: null }] },
  ],
  changeClass: number > 1 ? 'editorial' : null, changeSummary: number > 1 ? 'Wording' : null, rereadDays: 14, author: { id: 'a', name: 'Jörg Łukasik' }, editors: [],
  basedOn: number > 1 ? { id: V1, number: 1 } : null, changeCheck: null, createdAt: '2026-03-01T09:00:00.000Z', updatedAt: '2026-03-01T09:00:00.000Z',
  submittedAt: null, returned: null, approval: null, publishedAt: null, reviewDueOn: null, reviewOverdue: false, supersededAt: null, withdrawn: null,
  siteTimeZone: 'Europe/Berlin', myAcknowledgement: null,
});

function serve(put: (c: Call) => { status?: number; body?: unknown }) {
  return fakeFetch((c) => {
    if (c.method === 'GET' && c.url.pathname === `/api/procedures/${P}/versions/${V2}`) return { body: version(V2, 2, 'draft') };
    if (c.method === 'GET' && c.url.pathname === `/api/procedures/${P}/versions/${V1}`) return { body: version(V1, 1, 'superseded') };
    if (c.method === 'PUT') return put(c);
    return undefined;
  });
}
const open = () => mountWith(ProcedureEditView, { user: userWith(['manager']), path: `/procedures/${P}/versions/${V2}/edit` });

describe('the procedure editor', () => {
  it('when a step is moved up and the draft saved, then the new order goes to the server with the step keys kept', async () => {
    const calls = serve((c) => ({ body: { ...version(V2, 2, 'draft'), steps: (c.body as { steps: typeof steps }).steps } }));
    await open();
    expect(document.body.textContent).toContain('All changes saved');
    getByRole('button', 'Move step 2 up').click();
    await settle();
    expect(document.body.textContent).toContain('Unsaved changes');
    // The hold point now has no step before it: the editor warns before the server does.
    expect(document.body.textContent).toContain('The hold point at step 1 (step 2 before) moved');
    getByRole('button', 'Save the draft').click();
    await settle();
    const sent = calls.find((c) => c.method === 'PUT')!.body as { steps: { key: string; holdPoint: boolean }[]; changeClass: string };
    expect(sent.steps.map((s) => [s.key, s.holdPoint])).toEqual([[K(2), true], [K(1), false]]);
    expect(sent.changeClass).toBe('editorial');
  });

  it('when the server refuses a field, then its message shows beside that field', async () => {
    serve(() => ({ status: 400, body: { error: { code: 'invalid_input', message: 'steps.1.text: write the step (at least 3 characters)', fields: { 'steps.1.text': 'write the step (at least 3 characters)' } } } }));
    await open();
    await type(getByRole('textbox', 'Step 2 text'), 'ok');
    getByRole('button', 'Save the draft').click();
    await settle();
    expect(messagesBeside(getByRole('textbox', 'Step 2 text'))).toBe('write the step (at least 3 characters)');
    expect(messagesBeside(getByRole('textbox', 'Step 1 text'))).toBe('');
  });
});
