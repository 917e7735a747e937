import type { ChainIssueKind } from '@shared/register/views';

/** How each kind of chain problem is named on the audit trail page. */
export const CHAIN_ISSUE_LABELS: Record<ChainIssueKind, string> = {
  truncated_tail: 'Truncated tail',
  gap: 'Gap',
  fork: 'Fork',
  edited: 'Edited entry',
  unsealed_inside: 'Entry without a seal inside the chain',
  anchor_mismatch: 'Head does not match the anchor',
  anchor_forged: 'Anchor line not written with the key',
};
