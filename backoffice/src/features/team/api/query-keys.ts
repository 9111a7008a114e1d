/** The team and its absences live under ['team']; invitations and absences invalidate `all`. */
export const teamKeys = {
  all: ['team'] as const,
  members: () => [...teamKeys.all, 'members'] as const,
  absences: () => [...teamKeys.all, 'absences'] as const,
};
