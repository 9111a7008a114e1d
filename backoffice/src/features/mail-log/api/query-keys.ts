import type { MailLogQuery } from '@loomwright/shared';

/** The outgoing-mail log; resending a message invalidates `all`. */
export const mailLogKeys = {
  all: ['mail-log'] as const,
  list: (query: MailLogQuery) => [...mailLogKeys.all, 'list', query] as const,
};
