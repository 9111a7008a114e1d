import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { builderLevels } from '../domain';
import { demoPriceBook } from '../price-book/demo-price-book';
import { EstimateInputError } from './errors';
import { estimateRig } from './estimate-rig';
import { referenceBoard } from './reference-rigs.fixture';
import { pinBooks, seededRigs } from './seeded-rigs.fixture';

/**
 * A regression pin, not an outside check: the engine's whole answer (every line, total, note and
 * check) for 2,000 seeded configurations and the reference boards, as it stood before the engine
 * was made faster, so a speed change cannot move a cent or a field. The figures themselves are
 * checked against their sources in estimate-rig.spec.ts and the checks' own specs.
 *
 * The file snapshot holds one line per configuration: the totals in words a person can read, and a
 * SHA-256 (FIPS 180-4, through node:crypto) of the answer written as JSON with its keys sorted, so
 * the order keys are built in does not count but every value does. A changed line names the
 * configuration that moved; re-write the file (`vitest -u`) only for an intended change of answers.
 */
const canonical = (value: unknown): unknown => {
  if (Array.isArray(value)) return value.map(canonical);
  if (value && typeof value === 'object') {
    return Object.fromEntries(
      Object.keys(value)
        .filter((k) => (value as Record<string, unknown>)[k] !== undefined)
        .sort()
        .map((k) => [k, canonical((value as Record<string, unknown>)[k])]),
    );
  }
  return value;
};
const digest = (value: unknown) =>
  createHash('sha256')
    .update(JSON.stringify(canonical(value)))
    .digest('hex')
    .slice(0, 20);

function pinLine(label: string, price: () => ReturnType<typeof estimateRig>): string {
  try {
    const r = price();
    return `${label} ${r.currency} ${r.totalLow}–${r.totalHigh} deposit ${r.deposit} hours ${r.laborHours} lines ${r.lines.length} ${digest(r)}`;
  } catch (e) {
    if (e instanceof EstimateInputError) return `${label} refused ${e.field}: ${e.message}`;
    throw e;
  }
}

describe('the engine’s answers, pinned', () => {
  it('prices 2,000 seeded configurations exactly as before (seed 20261202)', async () => {
    const rigs = seededRigs(2_000, 20261202);
    const text = rigs.map(({ bookName, config, meta }, i) =>
      pinLine(`#${i} ${bookName}`, () => estimateRig(config, pinBooks[bookName], meta)),
    );
    // The set is broad: both routings, the quick count, refusals and every book.
    expect(rigs.filter((r) => r.config.routing.mode === 'switcher').length).toBeGreaterThan(600);
    expect(rigs.filter((r) => r.config.pedalCount !== undefined).length).toBeGreaterThan(50);
    expect(text.filter((l) => l.includes(' refused ')).length).toBeGreaterThan(20);
    await expect(`${text.join('\n')}\n`).toMatchFileSnapshot('./__snapshots__/estimate-pin.seeded.txt');
  });

  it('prices the reference boards exactly as before, at every level and in two locales', async () => {
    const text = (['serial', 'switcher'] as const).flatMap((mode) =>
      builderLevels.flatMap((level) =>
        [undefined, 'de-DE'].map((locale) =>
          pinLine(`${mode} ${level} ${locale ?? 'default'}`, () =>
            estimateRig(referenceBoard(mode, level), demoPriceBook, { version: 1, ...(locale ? { locale } : {}) }),
          ),
        ),
      ),
    );
    await expect(`${text.join('\n')}\n`).toMatchFileSnapshot('./__snapshots__/estimate-pin.reference.txt');
  });

  it('gives the same answer twice for the same configuration and book (nothing carried between estimates)', () => {
    const rigs = seededRigs(200, 7);
    const first = rigs.map(({ bookName, config, meta }) => pinLine('', () => estimateRig(config, pinBooks[bookName], meta)));
    const again = [...rigs].reverse().map(({ bookName, config, meta }) => pinLine('', () => estimateRig(config, pinBooks[bookName], meta)));
    expect(again.reverse()).toEqual(first);
  });
});
