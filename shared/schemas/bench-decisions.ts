import { z } from 'zod';
import './messages.js';
import { paragraph } from './text.js';

/** A manager's decision that a Type AC bench may still be used for practicals on phase-cut loads. */
export const typeAcDecisionBody = z.object({
  reason: paragraph().min(10, 'say why the bench is safe to use (at least 10 characters), e.g. the Type A device ahead of it').max(2000, 'use at most 2000 characters'),
});
export type TypeAcDecisionBody = z.infer<typeof typeAcDecisionBody>;

export interface TypeAcDecisionView {
  id: string;
  benchId: string;
  decidedById: string;
  decidedByName: string;
  decidedAt: string;
  reason: string;
}

/** Why a Type AC bench is refused for a practical until a manager decides otherwise. */
export const TYPE_AC_REFUSAL =
  'has a Type AC RCD: a phase-cut load leaks pulsating DC that can blind it, so no practical is opened on it until a manager records why it is safe (or a Type A or better device is fitted)';
