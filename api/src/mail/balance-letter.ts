import type { MoneyFacts } from '@loomwright/shared';
import type { MailTemplateData } from './mail.types';

/**
 * The balance letter's figures, the same money facts as the player's build page: the firm quote,
 * approved extras, what was paid net of refunds and the balance due. Null when there is no firm
 * quote yet, so no balance to ask for.
 */
export function balanceLetterData(name: string, reference: string, money: MoneyFacts): MailTemplateData['balance-requested'] | null {
  if (money.balanceDue === null) return null;
  return {
    name,
    reference,
    ...(money.firmTotal !== null && { firmTotal: money.firmTotal }),
    extras: money.approvedExtras,
    paidSoFar: money.netPaid,
    balanceDue: money.balanceDue,
    currency: money.currency,
  };
}
