// Writes shared/src/money/iso-4217.ts from the `currency-codes` dataset (ISO 4217 List One): each
// code with its "Minor unit" digits, nothing else, so the apps' first page can carry the table
// (the dataset with its country lists is several times larger). iso-4217.spec.ts fails when the
// written table and the installed dataset differ: run `node shared/scripts/iso-4217.mjs` then.
import { writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);
const cc = require('currency-codes');
const published = require('currency-codes/iso-4217-publish-date');
const digits = Object.fromEntries(
  cc.data
    .filter((c) => typeof c.digits === 'number')
    .map((c) => [c.code, c.digits])
    .sort(([a], [b]) => (a < b ? -1 : 1)),
);
const out = `// Written by shared/scripts/iso-4217.mjs from the currency-codes dataset; do not edit by hand.
/** ISO 4217 List One, "Minor unit" column, as the \`currency-codes\` package publishes it (list dated ${published}). */
export const ISO_4217_PUBLISHED = '${published}';

export const ISO_4217_MINOR_UNITS: Readonly<Record<string, number>> = ${JSON.stringify(digits)};
`;
writeFileSync(new URL('../src/money/iso-4217.ts', import.meta.url), out);
console.log(`${Object.keys(digits).length} codes, list dated ${published}`);
