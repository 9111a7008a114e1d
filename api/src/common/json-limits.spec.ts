import { describe, expect, it } from 'vitest';
import { findBodyProblem, MAX_BODY_DEPTH } from './json-limits';

/** `[[[…]]]` with `levels` arrays around a 1. */
const nested = (levels: number): unknown => (levels === 0 ? 1 : [nested(levels - 1)]);

// A lone surrogate (U+D800–U+DFFF unpaired) cannot be encoded in UTF-8: RFC 3629 §3. JSON text may
// still carry one as an escape (ECMA-262, well-formed JSON.stringify), so a parsed body can hold it.
describe('findBodyProblem', () => {
  it('finds a lone surrogate in a value, in a key, in an array, and in a query object without a prototype', () => {
    expect(findBodyProblem({ name: 'x\ud800' })).toBe('lone-surrogate');
    expect(findBodyProblem({ ['k\udc00']: 1 })).toBe('lone-surrogate');
    expect(findBodyProblem({ pedals: [{ notes: ['fine', 'half \udfff pair'] }] })).toBe('lone-surrogate');
    const query = Object.assign(Object.create(null) as Record<string, unknown>, { q: '\ud83d' });
    expect(findBodyProblem(query)).toBe('lone-surrogate');
    expect(findBodyProblem('\ud800')).toBe('lone-surrogate');
  });

  it('takes well-formed text, astral characters included (a surrogate pair is one code point)', () => {
    expect(findBodyProblem({ name: 'Zoë 🎸', list: ['–', '×'], n: 3, ok: true, none: null })).toBeNull();
    expect(findBodyProblem(undefined)).toBeNull();
    expect(findBodyProblem({})).toBeNull();
  });

  it('refuses nesting past the limit and takes it up to the limit', () => {
    expect(findBodyProblem(nested(MAX_BODY_DEPTH))).toBeNull();
    expect(findBodyProblem(nested(MAX_BODY_DEPTH + 1))).toBe('too-deep');
  });
});
