import { useMutation } from '@tanstack/react-query';
import type { PasswordResetRequestInput } from '@loomwright/shared';
import { api } from 'src/lib/api-client';

export const requestPasswordReset = (input: PasswordResetRequestInput) => api.post<{ message: string }>('/auth/password-reset', input);

export const useRequestPasswordReset = () => useMutation({ mutationFn: requestPasswordReset });
