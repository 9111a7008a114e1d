/** A build's bench records (intake, hours, extras, cancellation terms) live under ['builds', id]. */
export const buildKeys = {
  all: ['builds'] as const,
  build: (id: string) => [...buildKeys.all, id] as const,
  cancellation: (id: string) => [...buildKeys.build(id), 'cancellation'] as const,
  extras: (id: string) => [...buildKeys.build(id), 'extras'] as const,
  intake: (id: string) => [...buildKeys.build(id), 'intake'] as const,
  timeEntries: (id: string) => [...buildKeys.build(id), 'time-entries'] as const,
};
