import { afterEach, describe, expect, it, vi } from 'vitest';
import ProcedureEditView from '@/views/ProcedureEditView.vue';
import ChecklistView from '@/components/ChecklistView.vue';
import { fakeFetch, getByRole, messagesBeside, mountWith, nameOf, settle, userWith } from './support';

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

const P = '30000000-0000-4000-8000-000000000001';
const V2 = '30000000-0000-4000-8000-000000000012';
const K = (n: number) => `40000000-0000-4000-8000-00000000000${n}`;
const steps = [
  { key: K(1), text: 'Unplug the unit.', caution: null, holdPoint: false },
  { key: K(2), text: 'Connections checked before switch-on.', caution: null, holdPoint: true },
];
const version = {
  id: V2, procedureId: P, code: 'BO-T-01', number: 2, status: 'draft', inForce: false, title: 'Triac repair', category: 'dead-work', reviewPeriodMonths: 12,
  scope: 'Bench repair.', hazards: ['Stored charge'], ppe: [], equipment: [], steps, checklists: [
    { id: null, key: K(5), kind: 'practical-assessment', title: 'Assessor record', items: [{ id: null, key: K(6), kind: 'tick', prompt: 'Clips secure', guidance: null, unit: null, rule: null, ruleText: null, stepKey: K(2) }] },
  ],
  changeClass: 'editorial', changeSummary: 'Wording', rereadDays: 14, author: { id: 'a', name: 'Jörg Łukasik' }, editors: [],
  basedOn: null, changeCheck: null, createdAt: '2026-03-01T09:00:00.000Z', updatedAt: '2026-03-01T09:00:00.000Z',
  submittedAt: null, returned: null, approval: null, publishedAt: null, reviewDueOn: null, reviewOverdue: false, supersededAt: null, withdrawn: null,
  siteTimeZone: 'Europe/Berlin', myAcknowledgement: null,
};
type Sent = { checklists: { items: { prompt: string; stepKey: string | null }[] }[] };

function serve(put: () => { status?: number; body?: unknown }) {
  return fakeFetch((c) => {
    if (c.method === 'GET' && c.url.pathname === `/api/procedures/${P}/versions/${V2}`) return { body: version };
    if (c.method === 'PUT') return put();
    return undefined;
  });
}
const open = () => mountWith(ProcedureEditView, { user: userWith(['manager']), path: `/procedures/${P}/versions/${V2}/edit` });
const stepField = (n: number) => [...document.querySelectorAll<HTMLInputElement>('input')].find((el) => nameOf(el) === `Item ${n} belongs to step`)!;
const shown = (n: number) => stepField(n).closest('.v-field')?.textContent ?? '';

describe('linking checklist items to steps in the editor', () => {
  it('when an item is added and another moved to step 1, then each select lists the steps and the save carries the links', async () => {
    const calls = serve(() => ({ body: version }));
    await open();
    expect(shown(1)).toContain('Step 2 (hold point): Connections checked before switch-on.');
    getByRole('button', 'Add an item to checklist 1').click();
    await settle();
    // A new item belongs to the step of the item before it.
    expect(shown(2)).toContain('Step 2 (hold point)');
    (stepField(1).closest('.v-field') as HTMLElement).dispatchEvent(new MouseEvent('mousedown', { bubbles: true }));
    stepField(1).closest('.v-field')!.querySelector<HTMLElement>('input')!.click();
    await settle();
    const options = [...document.querySelectorAll<HTMLElement>('[role="option"]')];
    expect(options.map((o) => o.textContent?.trim())).toEqual(['No particular step', 'Step 1: Unplug the unit.', 'Step 2 (hold point): Connections checked before switch-on.']);
    options[1].click();
    await settle();
    expect(shown(1)).toContain('Step 1: Unplug the unit.');
    getByRole('button', 'Save the draft').click();
    await settle();
    const sent = calls.find((c) => c.method === 'PUT')!.body as Sent;
    expect(sent.checklists[0].items.map((i) => i.stepKey)).toEqual([K(1), K(2)]);
  });

  it('when the server refuses a link, then its message shows beside that item’s step select', async () => {
    serve(() => ({ status: 422, body: { error: { code: 'unprocessable', message: 'checklists.0.items.0.stepKey: not a step of this version; choose one of its steps', fields: { 'checklists.0.items.0.stepKey': 'not a step of this version; choose one of its steps' } } } }));
    await open();
    getByRole('button', 'Remove step 2').click();
    await settle();
    getByRole('button', 'Save the draft').click();
    await settle();
    expect(messagesBeside(stepField(1))).toBe('not a step of this version; choose one of its steps');
  });

  it('when a published version is read, then each linked item names its step', async () => {
    fakeFetch(() => undefined);
    await mountWith(ChecklistView, { user: userWith(['technician']), props: { checklists: version.checklists, steps } });
    const chips = [...document.querySelector('li')!.querySelectorAll('.v-chip')].map((c) => c.textContent!.trim());
    expect(chips).toEqual(['Tick box', 'Step 2 (hold point)']);
  });
});
