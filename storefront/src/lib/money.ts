/** Kept for older imports: money is written by the one formatter in ./format. */
export { formatHours, formatMoney, formatMoneyRange } from './format';
