import { quantityWithUnit, type EstimateResult } from '@loomwright/shared';
import type { QuoteMailLine } from './mail.types';

/** An estimate's line items as the quote e-mails list them (amounts stay decimal strings). */
export const quoteMailLines = (estimate: EstimateResult): QuoteMailLine[] =>
  estimate.lines.map((l) => ({
    label: l.label,
    quantity: quantityWithUnit(l.quantity, l.unit),
    amount: l.amount,
    ...(l.amountHigh && l.amountHigh !== l.amount && { amountHigh: l.amountHigh }),
  }));
