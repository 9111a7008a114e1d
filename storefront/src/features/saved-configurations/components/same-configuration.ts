import stableStringify from 'fast-json-stable-stringify';
import type { RigConfiguration } from '@loomwright/shared';

/** Equal configurations whatever their key order (PostgreSQL's jsonb does not keep it). */
export const sameConfiguration = (a: RigConfiguration, b: RigConfiguration) => stableStringify(a) === stableStringify(b);
