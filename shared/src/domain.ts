/** Words of the domain that every part of Loomwright uses with the same meaning. */

export const userRoles = ['customer', 'builder', 'owner'] as const;
export type UserRole = (typeof userRoles)[number];
export const staffRoles: readonly UserRole[] = ['builder', 'owner'];

export const builderLevels = ['apprentice', 'journeyman', 'master'] as const;
export type BuilderLevel = (typeof builderLevels)[number];

/** Rank of a level, for "at least journeyman" comparisons. */
export const levelRank = (level: BuilderLevel): number => builderLevels.indexOf(level);

/**
 * A build's life: draft → requested → deposit_paid → scheduled → pedals_received → on_bench
 * → testing → ready → delivered; declined, cancelled and refunded are exits.
 */
export const bookingStates = [
  'draft',
  'requested',
  'deposit_paid',
  'scheduled',
  'pedals_received',
  'on_bench',
  'testing',
  'ready',
  'delivered',
  'declined',
  'cancelled',
  'refunded',
] as const;
export type BookingState = (typeof bookingStates)[number];

/** Plain words for each state, the same in the storefront, the backoffice and e-mail. */
export const bookingStateLabels: Record<BookingState, string> = {
  draft: 'Draft',
  requested: 'Requested, deposit not paid yet',
  deposit_paid: 'Deposit paid, waiting for a bench date',
  scheduled: 'Scheduled',
  pedals_received: 'Pedals received and checked in',
  on_bench: 'On the bench',
  testing: 'Testing',
  ready: 'Ready, balance due',
  delivered: 'Delivered',
  declined: 'Declined by the shop',
  cancelled: 'Cancelled',
  refunded: 'Deposit refunded',
};

/** Bench hours per ISO weekday, "1" = Monday … "7" = Sunday; a missing day is a day off. */
export type WeeklyHours = Partial<Record<'1' | '2' | '3' | '4' | '5' | '6' | '7', number>>;

export interface AuthUser {
  id: string;
  email: string;
  name: string;
  role: UserRole;
}
