import type { Deps } from '../deps.js';
import type { Executor } from '../db/client.js';
import type { AuthService } from '../auth/auth.service.js';
import { insertSignature, signaturesFor, type SignatureRow } from './signatures.repository.js';

export interface SignatureRequest {
  signerId: string;
  password: string | undefined;
  meaning: string;
  entity: string;
  entityId: string;
}

/**
 * Signing is two steps: `verify` the re-entered password before the transaction (a wrong one changes
 * nothing), then `record` inside the transaction of the change it signs.
 */
export function makeSignatures({ clock, audit }: Deps, auth: AuthService) {
  async function verify(signerId: string, password: string | undefined) {
    const user = await auth.confirmSignature(signerId, password);
    return { signerId: user.id, printedName: user.name };
  }

  async function record(tx: Executor, signer: { signerId: string; printedName: string }, what: { meaning: string; entity: string; entityId: string }) {
    const row = await insertSignature(tx, { ...signer, ...what, signedAt: clock.now() });
    await audit(tx, { actorId: signer.signerId, action: 'signature.made', entity: what.entity, entityId: what.entityId, newValues: { meaning: what.meaning, printedName: signer.printedName, signedAt: row.signedAt } });
    return row;
  }

  return { verify, record, list: (db: Executor, entity: string, ids: string[]) => signaturesFor(db, entity, ids) };
}

export type Signatures = ReturnType<typeof makeSignatures>;

/** How a signature is shown on screen and on every PDF. */
export function presentSignature(s: SignatureRow) {
  return { id: s.id, signerId: s.signerId, printedName: s.printedName, meaning: s.meaning, signedAt: s.signedAt.toISOString() };
}
