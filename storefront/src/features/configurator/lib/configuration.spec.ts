import { describe, expect, it } from 'vitest';
import { decodeConfiguration, demoPriceBook, encodeConfiguration, type Catalog } from '@loomwright/shared';
import { completeConfiguration, startingConfiguration } from './configuration';

const catalog: Catalog = { ...demoPriceBook, priceBookVersion: 1, publishedAt: '2026-12-01T00:00:00Z' };

describe('the configuration a URL or a stored draft holds', () => {
  it('starts from a common rig: a 610 mm prefab board, a hard case, six serial pedals', () => {
    expect(startingConfiguration(catalog)).toEqual({
      surfaceId: 'slate-61',
      caseId: 'shell-hard',
      routing: { mode: 'serial' },
      pedalCount: 6,
      functions: [],
      level: 'apprentice',
    });
  });

  it('keeps what still exists in the price book and replaces what does not', () => {
    const restored = completeConfiguration(
      { surfaceId: 'gone-board', caseId: 'tour-road', routing: { mode: 'serial' }, pedalCount: 9, functions: ['four_cable', 'retired'], level: 'master' },
      catalog,
    );
    expect(restored).toEqual({
      surfaceId: 'slate-61',
      caseId: 'tour-road',
      routing: { mode: 'serial' },
      pedalCount: 9,
      functions: ['four_cable'],
      level: 'master',
    });
  });

  it('turns a count into a list on a switcher board, since loops need named pedals', () => {
    const restored = completeConfiguration({ routing: { mode: 'switcher' }, pedalCount: 3 }, catalog);
    expect(restored.pedalCount).toBeUndefined();
    expect(restored.pedals?.map((p) => p.name)).toEqual(['Pedal 1', 'Pedal 2', 'Pedal 3']);
  });

  it('survives the URL codec unchanged', () => {
    const c = completeConfiguration(
      { routing: { mode: 'switcher' }, pedals: [{ name: 'Fuzz “Ø”', powered: true, inLoop: true, currentMa: 10 }], functions: [], level: 'journeyman' },
      catalog,
    );
    expect(completeConfiguration(decodeConfiguration(encodeConfiguration(c)), catalog)).toEqual(c);
  });
});
