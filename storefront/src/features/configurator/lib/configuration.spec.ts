import { describe, expect, it } from 'vitest';
import { decodeConfiguration, demoPriceBook, encodeConfiguration, type Catalog } from '@loomwright/shared';
import { completeConfiguration, missingChoices, startingConfiguration } from './configuration';

const catalog: Catalog = { ...demoPriceBook, priceBookVersion: 1, publishedAt: '2026-12-01T00:00:00Z' };

describe('the configuration a URL or a stored draft holds', () => {
  it('starts with nothing chosen: no surface, case or pedals the player did not pick', () => {
    const start = startingConfiguration(catalog);
    expect(start).toEqual({ surfaceId: '', caseId: '', routing: { mode: 'serial' }, functions: [], level: 'apprentice' });
    expect(missingChoices(start)).toEqual(['surface', 'case', 'pedals']);
    expect(missingChoices({ ...start, surfaceId: 'slate-61', caseId: 'shell-hard', pedalCount: 4 })).toEqual([]);
    expect(missingChoices({ ...start, surfaceId: 'slate-61', routing: { mode: 'switcher' }, pedals: [] })).toEqual(['case', 'pedals']);
  });

  it('keeps what still exists in the price book and leaves the rest to choose again', () => {
    const restored = completeConfiguration(
      {
        surfaceId: 'gone-board',
        caseId: 'tour-road',
        routing: { mode: 'serial' },
        pedalCount: 9,
        functions: ['four_cable', 'retired'],
        level: 'master',
      },
      catalog,
    );
    expect(restored).toEqual({
      surfaceId: '',
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
      {
        routing: { mode: 'switcher' },
        pedals: [{ name: 'Fuzz “Ø”', powered: true, inLoop: true, currentMa: 10 }],
        functions: [],
        level: 'journeyman',
      },
      catalog,
    );
    expect(completeConfiguration(decodeConfiguration(encodeConfiguration(c)), catalog)).toEqual(c);
  });
});
