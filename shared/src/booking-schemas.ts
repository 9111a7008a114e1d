import { z } from 'zod';

/** POST /api/bookings/:id/shipment: the parcel carrying the player's pedals to the shop. */
export const shipmentSchema = z.object({
  carrier: z.string().trim().min(1, { error: 'Say who carries the parcel (carrier)' }).max(100, { error: 'Carrier: at most 100 characters' }),
  tracking: z.string().trim().min(1, { error: 'Give the tracking number (tracking)' }).max(100, { error: 'Tracking: at most 100 characters' }),
});
export type ShipmentInput = z.infer<typeof shipmentSchema>;

/** The notes a player adds to a build request. */
export const requestNotesSchema = z.object({
  notes: z.string().max(4000, { error: 'Notes: at most 4000 characters' }),
});
export type RequestNotesInput = z.infer<typeof requestNotesSchema>;

/** Photos the API accepts (checked again on the server by the file's bytes). */
export const PHOTO_MAX_BYTES = 8 * 1024 * 1024;
export const PHOTO_MAX_PER_BOOKING = 8;
export const PHOTO_TYPES = ['image/jpeg', 'image/png', 'image/webp'] as const;
