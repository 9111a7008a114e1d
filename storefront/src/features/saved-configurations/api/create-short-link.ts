import { useMutation } from '@tanstack/react-query';
import type { ConfigurationLink, RigConfiguration } from '@loomwright/shared';
import { api } from 'src/lib/api-client';

/** A short code for any configuration; the same configuration always gets the same code. */
export const createShortLink = (configuration: RigConfiguration) => api.post<ConfigurationLink>('/configuration-links', { configuration });

export const useCreateShortLink = () => useMutation({ mutationFn: createShortLink });
