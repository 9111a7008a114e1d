import Decimal from 'decimal.js';

export interface FirmQuoteFigures {
  laborTotal: string;
  total: string;
  balanceDue: string;
}

/**
 * The firm quote: the assigned builder's own rate turns the estimate's labor range into one
 * figure. Amounts round half-up to the currency's minor unit (cents for the demo shop's USD).
 */
export function firmQuoteFigures(input: {
  hourlyRate: string;
  laborHours: string;
  materialsTotal: string;
  deposit: string;
  minorUnits?: number;
}): FirmQuoteFigures {
  const dp = input.minorUnits ?? 2;
  const laborTotal = new Decimal(input.hourlyRate).times(input.laborHours).toDecimalPlaces(dp, Decimal.ROUND_HALF_UP);
  const total = laborTotal.plus(input.materialsTotal).toDecimalPlaces(dp, Decimal.ROUND_HALF_UP);
  const balance = Decimal.max(0, total.minus(input.deposit));
  return { laborTotal: laborTotal.toFixed(dp), total: total.toFixed(dp), balanceDue: balance.toFixed(dp) };
}
