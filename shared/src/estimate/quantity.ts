/** Units that read the same for one and for many: abbreviations, and "each". */
const invariantUnits = new Set(['each', 'ft', 'h', 'mm', 'mA', 'V']);

const irregular: Record<string, string> = { supply: 'supplies' };

/** "1 device", "9 devices", "26.00 ft", "1 each": a line's quantity with its unit, in words. */
export function quantityWithUnit(quantity: string, unit: string): string {
  const one = Number(quantity) === 1;
  return `${quantity} ${one || invariantUnits.has(unit) ? unit : (irregular[unit] ?? `${unit}s`)}`;
}
