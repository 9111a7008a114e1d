import { useMutation } from '@tanstack/react-query';
import type { EmailQuoteInput, QuoteEmailSent } from '@loomwright/shared';
import { api } from 'src/lib/api-client';

/** The quote of any configuration, e-mailed to the signed-in person's own address (PDF attached). */
export const emailQuote = (input: EmailQuoteInput) => api.post<QuoteEmailSent>('/quotes/email', input);

export const useEmailQuote = () => useMutation({ mutationFn: emailQuote });
