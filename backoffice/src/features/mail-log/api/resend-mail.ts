import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MailLogEntry, ResendMailInput } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { mailLogKeys } from './query-keys';

export type ResendMailVariables = { id: string } & NonNullable<ResendMailInput>;

export const resendMail = ({ id, ...body }: ResendMailVariables) => api.post<MailLogEntry>(`/mail/${encodeURIComponent(id)}/resend`, body);

export function useResendMail() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: resendMail,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: mailLogKeys.all }),
  });
}
