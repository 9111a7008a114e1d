import Decimal from 'decimal.js';
import type { CaseItem, FunctionItem, LevelItem, PriceBook, SurfaceItem } from '../price-book/types';
import { shopFormat } from '../format/shop-format';

/**
 * What an estimate reads from its price book that no configuration changes: the items by id or
 * code, the rates' words. Worked out once per book object and kept while the book is (a WeakMap:
 * a book nobody holds any more takes its index with it). A published book is never changed in
 * place (a new version is a new object), so the index stays true for as long as the book lives.
 */
export interface BookIndex {
  surfaces: Map<string, SurfaceItem>;
  cases: Map<string, CaseItem>;
  functions: Map<string, FunctionItem>;
  levels: Map<string, LevelItem>;
  /** A level's rate range in the shop's money and locale ("$80.00–$100.00"), by `code|locale`. */
  rateWords: Map<string, string>;
}

/** Items by key; on a repeated key the first one wins, as a search from the front of the list finds it. */
function byKey<T>(items: T[], key: (item: T) => string): Map<string, T> {
  const map = new Map<string, T>();
  for (const item of items) if (!map.has(key(item))) map.set(key(item), item);
  return map;
}

const indexes = new WeakMap<PriceBook, BookIndex>();

export function bookIndex(book: PriceBook): BookIndex {
  let index = indexes.get(book);
  if (!index) {
    index = {
      surfaces: byKey(book.surfaces, (s) => s.id),
      cases: byKey(book.cases, (c) => c.id),
      functions: byKey(book.functions, (f) => f.code),
      levels: byKey(book.levels, (l) => l.code),
      rateWords: new Map(),
    };
    indexes.set(book, index);
  }
  return index;
}

/** The level's rates in words with the currency, in the shop's locale: built through Intl once per level and locale. */
export function rateWordsOf(index: BookIndex, level: LevelItem, currency: string, locale: string | undefined): string {
  const key = `${level.code}|${locale ?? ''}`;
  let words = index.rateWords.get(key);
  if (words === undefined) {
    words = shopFormat({ currency, ...(locale && { locale }) }).moneyRange(
      new Decimal(level.rateLow).toFixed(),
      new Decimal(level.rateHigh).toFixed(),
    );
    index.rateWords.set(key, words);
  }
  return words;
}
