import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PhotoView } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { bookingKeys } from './query-keys';

export const uploadPhoto = ({ id, file, caption }: { id: string; file: File; caption?: string }) => {
  const form = new FormData();
  form.append('file', file);
  if (caption) form.append('caption', caption);
  return api.post<PhotoView>(`/bookings/${encodeURIComponent(id)}/photos`, form);
};

export const useUploadPhoto = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: uploadPhoto,
    onSuccess: (_photo, { id }) => queryClient.invalidateQueries({ queryKey: bookingKeys.detail(id) }),
  });
};
