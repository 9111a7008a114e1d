/** Kept for older imports: amounts, days and moments are written by the one formatter in ./format. */
export { formatAmount, formatDay, formatMoment, formatRange } from './format';
