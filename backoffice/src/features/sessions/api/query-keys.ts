/** A person's signed-in sessions, one query per person. */
export const sessionKeys = {
  all: ['sessions'] as const,
  person: (userId: string) => [...sessionKeys.all, userId] as const,
};
