import { afterEach, describe, expect, it, vi } from 'vitest';
import AuthorisationEndReason from '@/components/AuthorisationEndReason.vue';
import { REREAD_RULE } from '@shared/procedures/reread-rule';
import { fakeFetch, mountWith, userWith } from './support';

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

const PROC = '40000000-0000-4000-8000-000000000001';
const SCOPE = '50000000-0000-4000-8000-000000000001';
const ACK_LABEL = 'Acknowledged BO-LIVE-02 “Live commissioning” (version in force)';
const scopes = [{ id: SCOPE, active: true, requirements: [{ id: 'r1', kind: 'procedure_ack', label: 'BO-LIVE-02', procedureId: PROC, scopeId: null, certificateKind: null, practicalsCount: null, practicalsWindowMonths: null }] }];
const snapshot = (expirySetBy: string) => ({
  expirySetBy,
  requirements: [{ kind: 'procedure_ack', label: ACK_LABEL, met: true, detail: '', evidence: [{ label: 'BO-LIVE-02 version 1 acknowledged (re-read of version 2 due 12 Mar 2026)' }] }],
});

describe('what sets the end date on the authorisation page', () => {
  it('when a re-read deadline ends it sooner, then the page names it, links to the procedure and states the one re-read rule', async () => {
    fakeFetch((c) => (c.url.pathname === '/api/scopes' ? { body: scopes } : undefined));
    await mountWith(AuthorisationEndReason, { user: userWith(['technician']), props: { snapshot: snapshot(ACK_LABEL), scopeId: SCOPE, validUntil: '2026-03-12' } });
    const box = document.querySelector('[data-testid="end-set-by"]')!;
    expect(box.textContent).toContain(`Ends 2026-03-12 (end of that day): set by ${ACK_LABEL}`);
    expect(box.querySelector('a')?.getAttribute('href')).toBe(`/procedures/${PROC}`);
    expect(box.textContent).toContain(REREAD_RULE);
  });

  it('when the scope’s validity sets it, then the page says so, with no link and no re-read rule', async () => {
    fakeFetch((c) => (c.url.pathname === '/api/scopes' ? { body: scopes } : undefined));
    await mountWith(AuthorisationEndReason, { user: userWith(['technician']), props: { snapshot: snapshot("the scope's validity of 24 months"), scopeId: SCOPE, validUntil: '2028-03-01' } });
    const box = document.querySelector('[data-testid="end-set-by"]')!;
    expect(box.textContent).toContain("set by the scope's validity of 24 months");
    expect(box.querySelector('a')).toBeNull();
    expect(box.textContent).not.toContain(REREAD_RULE);
  });
});
