import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MailLogEntry } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { mailLogKeys } from 'src/features/mail-log/api/get-mail-log';

export const resendMail = (id: string) => api.post<MailLogEntry>(`/mail/${encodeURIComponent(id)}/resend`);

export function useResendMail() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: resendMail,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: mailLogKeys.all }),
  });
}
