/** The engine's money rules come from the product's one source of minor units (money/minor-units.ts). */
export { minorUnitDigits, isKnownCurrency, roundToMinorUnit, formatMoney } from '../money/minor-units';
