import { AUTHORISATION_CAUTION, CERTIFICATE_KIND_LABELS, type CertificateKind } from '../../shared/authorisations/kinds.js';
import type { RenewHint } from '../../shared/authorisations/views.js';
import { formatDay } from '../authorisations/dates.js';

export interface AuthorisationNotice {
  holderName: string;
  siteName: string;
  scopeCode: string;
  scopeTitle: string;
  limits: string;
  validUntil: string;
  daysLeft: number;
  state: string;
  hints: RenewHint[];
  lapseReason: string | null;
}

export interface CertificateNotice {
  holderName: string;
  siteName: string;
  kind: CertificateKind;
  expiresOn: string;
  daysLeft: number;
  restingScopes: string[];
  liveWorkGrace: number | null;
}

export interface Mail {
  subject: string;
  text: string;
  kind: string;
}

const hello = (name: string) => `Hello ${name},\n\n`;
const lines = (hints: RenewHint[]) => hints.map((h) => `  - ${h.label}: ${h.detail}`).join('\n');

/** Before expiry (offset > 0) or once it has lapsed (offset 0); to the holder, or to a manager of their site. */
export function authorisationMail(n: AuthorisationNotice, offset: number, toHolder: boolean, recipientName: string, link: string): Mail {
  const whose = toHolder ? 'Your authorisation' : `${n.holderName}'s authorisation (${n.siteName})`;
  const what = `“${n.scopeTitle}” (${n.scopeCode}, ${n.limits})`;
  const until = formatDay(n.validUntil);
  if (offset === 0) {
    return {
      kind: 'authorisation-lapsed',
      subject: `Lapsed: ${toHolder ? 'your' : `${n.holderName}'s`} authorisation “${n.scopeTitle}”`,
      text: `${hello(recipientName)}${whose} for ${what} lapsed at the end of ${until}.${n.lapseReason ? `\n${n.lapseReason}` : ''}\n\n`
        + `${toHolder ? 'You may no longer do the work it covers' : `${n.holderName} may no longer do the work it covers`} until it is issued again.\n`
        + (n.hints.length ? `\nTo get it back:\n${lines(n.hints)}\n` : '')
        + `\nSee where it stands: ${link}\n\n${AUTHORISATION_CAUTION}\n`,
    };
  }
  return {
    kind: 'authorisation-reminder',
    subject: `${toHolder ? 'Your' : `${n.holderName}'s`} authorisation “${n.scopeTitle}” lapses on ${until}`,
    text: `${hello(recipientName)}${whose} for ${what} lapses at the end of ${until}, in ${n.daysLeft} day${n.daysLeft === 1 ? '' : 's'}. It is ${n.state.toLowerCase()} now.\n\n`
      + `To renew it before then:\n${lines(n.hints)}\n\nSee what is met and what is missing: ${link}\n\n${AUTHORISATION_CAUTION}\n`,
  };
}

export function certificateMail(n: CertificateNotice, offset: number, toHolder: boolean, recipientName: string, link: string): Mail {
  const name = CERTIFICATE_KIND_LABELS[n.kind] ?? n.kind;
  const whose = toHolder ? 'Your' : `${n.holderName}'s (${n.siteName})`;
  const rests = n.restingScopes.length ? `\nThese authorisations rest on it: ${n.restingScopes.join('; ')}.` : '';
  const grace = n.liveWorkGrace !== null ? `\nLive work resting on it is suspended ${n.liveWorkGrace ? `${n.liveWorkGrace} days after it expires` : 'when it expires'}, until a renewed certificate has been checked.` : '';
  const upload = toHolder ? 'Upload the renewed certificate for a manager to check' : 'Once the renewed certificate is uploaded, check it against the original';
  if (offset === 0) {
    return {
      kind: 'certificate-lapsed',
      subject: `Expired: ${toHolder ? 'your' : `${n.holderName}'s`} ${name} certificate`,
      text: `${hello(recipientName)}${whose} ${name} certificate expired at the end of ${formatDay(n.expiresOn)}.${rests}${grace}\n\n${upload}: ${link}\n`,
    };
  }
  return {
    kind: 'certificate-reminder',
    subject: `${toHolder ? 'Your' : `${n.holderName}'s`} ${name} certificate expires on ${formatDay(n.expiresOn)}`,
    text: `${hello(recipientName)}${whose} ${name} certificate expires at the end of ${formatDay(n.expiresOn)}, in ${n.daysLeft} day${n.daysLeft === 1 ? '' : 's'}.${rests}${grace}\n\n${upload}: ${link}\n`,
  };
}
