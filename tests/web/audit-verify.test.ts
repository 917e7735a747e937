import { afterEach, describe, expect, it, vi } from 'vitest';
import AuditVerifyPanel from '@/components/AuditVerifyPanel.vue';
import type { ChainReportView } from '@shared/register/views';
import { fakeFetch, getByRole, mountWith, settle, userWith } from './support';

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

const base: ChainReportView = {
  intact: true, checkedAt: '2026-03-02T09:00:00.000Z', entries: 120, sealed: 118, unsealed: 2,
  head: { id: 130, position: 118, hmac: 'ab'.repeat(32) }, lastAnchor: { at: '2026-03-02T08:50:00.000Z', id: 128, hmac: 'cd'.repeat(32), line: 4 },
  anchors: 4, issues: [], issueCount: 0,
};

async function verifyWith(report: ChainReportView) {
  const calls = fakeFetch((c) => (c.method === 'POST' && c.url.pathname === '/api/audit/verify' ? { body: report } : undefined));
  await mountWith(AuditVerifyPanel, { user: userWith(['auditor']) });
  getByRole('button', 'Verify the chain').click();
  await settle();
  await vi.waitFor(() => expect(calls).toHaveLength(1));
  await settle();
  return document.body.textContent!.replace(/\s+/g, ' ');
}

describe('the chain check on the audit trail page', () => {
  it('when the chain is intact with newer entries waiting, then it says intact, counts those as not yet sealed and names the last anchor', async () => {
    const text = await verifyWith(base);
    expect(text).toContain('Intact: all 118 sealed entries match');
    expect(text).toContain('2 newer entries are not yet sealed; that is no fault.');
    expect(text).toContain('Last anchor');
    expect(text).toContain('entry #128');
  });

  it('when problems are found, then each is listed by name and position with the entry it names', async () => {
    const entry = { id: 57, at: '2026-03-01T10:00:00.000Z', actorId: null, actorName: null, action: 'authorisation.revoked', entity: 'authorisation_period', entityId: 'p-1', oldValues: null, newValues: {} };
    const text = await verifyWith({
      ...base, intact: false, issueCount: 2,
      issues: [
        { kind: 'edited', position: 50, entryId: 57, anchorLine: null, detail: 'Entry #57 no longer matches its seal.', entry },
        { kind: 'truncated_tail', position: null, entryId: 140, anchorLine: 4, detail: 'The anchor names entry #140, but the trail now ends at #130.', entry: null },
      ],
    });
    expect(text).toContain('Not intact: 2 problems in 118 sealed entries');
    expect(text).toContain('Edited entry at position 50 (entry #57)');
    expect(text).toContain('That entry: authorisation.revoked on authorisation_period p-1');
    expect(text).toContain('Truncated tail (entry #140) — anchor line 4');
  });
});
