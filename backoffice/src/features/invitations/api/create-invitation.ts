import { useMutation } from '@tanstack/react-query';
import type { InvitationCreated, InviteStaffInput } from '@loomwright/shared';
import { api } from 'src/lib/api-client';

export const createInvitation = (input: InviteStaffInput) => api.post<InvitationCreated>('/invitations', input);

/** The owner invites a builder (the form invalidates the ['team'] queries on success). */
export const useCreateInvitation = () => useMutation({ mutationFn: createInvitation });
