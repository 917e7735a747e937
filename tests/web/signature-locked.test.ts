import { afterEach, describe, expect, it, vi } from 'vitest';
import PracticalAcknowledgePanel from '@/components/PracticalAcknowledgePanel.vue';
import ProcedureSignDialog from '@/components/ProcedureSignDialog.vue';
import { api, setUnauthorizedHandler } from '@/api';
import { fakeFetch, getByRole, messagesBeside, mountWith, settle, type, userWith } from './support';

// What the server answers for a signature on a locked account (server/auth/password-check.ts).
const LOCKED = 'this account is locked for 15 more minute(s) after too many wrong passwords';
const lockedReply = () => ({ status: 401, body: { error: { code: 'locked', message: `password: ${LOCKED}`, fields: { password: LOCKED } } } });

afterEach(() => {
  vi.unstubAllGlobals();
  setUnauthorizedHandler(() => {});
  document.body.innerHTML = '';
});

describe('a signature on a locked account', () => {
  it('when the technician signs on the assessor’s tablet while locked, then the lock shows beside the password and the assessor stays signed in', async () => {
    const calls = fakeFetch(() => lockedReply());
    const signedOut = vi.fn();
    setUnauthorizedHandler(signedOut);
    const sign = async (technician: string, password: string) => {
      await api.post('/practicals/p1/acknowledge', { technician, password });
    };
    await mountWith(PracticalAcknowledgePanel, {
      user: userWith(['assessor']), path: '/practicals/p1',
      props: { technician: { name: 'Tomasz Wójcik', email: 'technician@demo.breakover.test' }, outcome: 'competent', sign },
    });
    const box = document.querySelector('input[type="password"]') as HTMLInputElement;
    await type(box, 'the right password');
    getByRole('button', 'Sign as Tomasz Wójcik').click();
    await settle();
    expect(calls.at(-1)).toMatchObject({ method: 'POST', url: expect.objectContaining({ pathname: '/api/practicals/p1/acknowledge' }) });
    expect(messagesBeside(box)).toBe(LOCKED);
    expect(signedOut).not.toHaveBeenCalled();
  });

  it('when a procedure is signed while locked, then the dialog shows the lock beside the password and stays open', async () => {
    fakeFetch(() => lockedReply());
    const sign = async (password: string) => {
      await api.post('/procedures/x/versions/y/approve', { password });
    };
    await mountWith(ProcedureSignDialog, { user: userWith(['manager']), path: '/procedures', props: { modelValue: true, title: 'Approve version 2', meaning: 'approved for use', action: 'Sign and approve', sign } });
    const box = document.querySelector('input[type="password"]') as HTMLInputElement;
    await type(box, 'the right password');
    getByRole('button', 'Sign and approve').click();
    await settle();
    expect(messagesBeside(box)).toBe(LOCKED);
    expect(getByRole('button', 'Sign and approve'), 'still open').toBeTruthy();
  });
});
