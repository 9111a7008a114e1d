import type { BenchPreviewQuery } from './get-bench-preview';
import type { BenchQuery } from './get-bench';

/** Every bench query lives under ['bench']; anything that books, moves or frees bench time invalidates `all`. */
export const benchKeys = {
  all: ['bench'] as const,
  view: (query: BenchQuery) => [...benchKeys.all, 'view', query] as const,
  preview: (query: BenchPreviewQuery) => [...benchKeys.all, 'preview', query] as const,
  suggestion: (bookingId: string) => [...benchKeys.all, 'suggest', bookingId] as const,
};
