import { afterEach, describe, expect, it, vi } from 'vitest';
import InstrumentEditDialog from '@/components/InstrumentEditDialog.vue';
import ProcedureSignDialog from '@/components/ProcedureSignDialog.vue';
import { ApiError } from '@/api/client';
import { alertBoxes, fakeFetch, getByRole, messagesBeside, mountWith, settle, sitesReply, type, userWith } from './support';

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

describe('dialogs on the shared form frame', () => {
  it('when the server refuses the serial, then its message shows beside that field; a refusal naming no field shows above the form', async () => {
    let reply = { status: 409, body: { error: { code: 'conflict', message: 'serial: already on record', fields: { serial: 'already on record at this site' } } } };
    const calls = fakeFetch((c) => sitesReply(c) ?? (c.method === 'POST' ? reply : undefined));
    await mountWith(InstrumentEditDialog, { user: userWith(['manager']), path: '/instruments', props: { modelValue: true, instrument: null } });
    await type(getByRole('textbox', 'Serial number'), 'MM-0042');
    getByRole('button', 'Save the instrument').click();
    await settle();
    expect(calls.at(-1)).toMatchObject({ method: 'POST', url: expect.objectContaining({ pathname: '/api/instruments' }) });
    expect(messagesBeside(getByRole('textbox', 'Serial number'))).toBe('already on record at this site');

    reply = { status: 403, body: { error: { code: 'forbidden', message: 'You may not add instruments at that site.', fields: {} } } } as typeof reply;
    getByRole('button', 'Save the instrument').click();
    await settle();
    expect(messagesBeside(getByRole('textbox', 'Serial number')), 'the old field message is cleared').toBe('');
    expect(alertBoxes().map((a) => a.textContent?.trim())).toContain('You may not add instruments at that site.');
  });

  it('when the password is wrong, then the signature dialog says so beside the password and stays open', async () => {
    const sign = vi.fn(async (_password: string) => {
      throw new ApiError(401, 'invalid_signature', 'password: that is not your password', { password: 'that is not your password' });
    });
    await mountWith(ProcedureSignDialog, { user: userWith(['manager']), path: '/procedures', props: { modelValue: true, title: 'Approve version 2', meaning: 'approved for use', action: 'Sign and approve', sign } });
    expect(document.body.textContent).toContain('Your signature will read: “approved for use”');
    const box = document.querySelector('input[type="password"]') as HTMLInputElement;
    await type(box, 'not-my-password');
    getByRole('button', 'Sign and approve').click();
    await settle();
    expect(sign).toHaveBeenCalledWith('not-my-password');
    expect(messagesBeside(box)).toBe('that is not your password');
    expect(getByRole('button', 'Sign and approve'), 'still open').toBeTruthy();
  });
});
