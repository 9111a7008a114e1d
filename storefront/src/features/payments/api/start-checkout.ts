import { useMutation } from '@tanstack/react-query';
import { api } from 'src/lib/api-client';

/** The hosted checkout for what the booking owes now (deposit, later the balance). */
export const startCheckout = (bookingId: string) => api.post<{ url: string }>(`/bookings/${encodeURIComponent(bookingId)}/checkout`, {});

export const useStartCheckout = () => useMutation({ mutationFn: startCheckout });
