import type { Migration } from 'kysely';
import * as foundation from './20261201_0001_foundation';
import * as domain from './20261201_0002_domain';
import * as mailDelivery from './20261201_0400_mail_delivery';
import * as passwordChangedAt from './20261201_0200_password_changed_at';
import * as photoVariants from './20261202_0217_photo_variants';
import * as sessionsAndRateLimits from './20261202_0236_sessions_and_rate_limits';
import * as approvalsAndRecords from './20261202_0301_approvals_and_records';
import * as paymentOutcomes from './20261202_0303_payment_outcomes';
import * as mailUnknownOutcome from './20261202_0333_mail_unknown_outcome';
import * as benchChanges from './20261202_0413_bench_changes';
import * as shopLocale from './20261202_0530_shop_locale';
import * as officeIndexes from './20261202_0546_office_indexes';
import * as listsAtScale from './20261202_0614_lists_at_scale';
import * as calendarFeeds from './20261202_0708_calendar_feeds';
import * as savedConfigurations from './20261202_0727_saved_configurations';
import * as shopPostalAddress from './20261202_0745_shop_postal_address';
import * as holidayChoices from './20261202_0957_holiday_choices';
import * as laborLineBasis from './20261202_1041_labor_line_basis';
import * as buildMessages from './20261202_1101_build_messages';
import * as reminders from './20261202_1105_reminders';
import * as bookingDepositStatus from './20261202_1345_booking_deposit_status';
import * as buildsListOrders from './20261202_1405_builds_list_orders';
import * as benchNotify from './20261203_0700_bench_notify';

/**
 * Every migration, by its sortable name. Listed statically so the same list runs from the
 * compiled build and under vitest; append new ones at the end, never rename old ones.
 */
export const migrations: Record<string, Migration> = {
  '20261201_0001_foundation': foundation,
  '20261201_0002_domain': domain,
  '20261201_0200_password_changed_at': passwordChangedAt,
  '20261201_0400_mail_delivery': mailDelivery,
  '20261202_0217_photo_variants': photoVariants,
  '20261202_0236_sessions_and_rate_limits': sessionsAndRateLimits,
  '20261202_0301_approvals_and_records': approvalsAndRecords,
  '20261202_0303_payment_outcomes': paymentOutcomes,
  '20261202_0333_mail_unknown_outcome': mailUnknownOutcome,
  '20261202_0413_bench_changes': benchChanges,
  '20261202_0530_shop_locale': shopLocale,
  '20261202_0546_office_indexes': officeIndexes,
  '20261202_0614_lists_at_scale': listsAtScale,
  '20261202_0708_calendar_feeds': calendarFeeds,
  '20261202_0727_saved_configurations': savedConfigurations,
  '20261202_0745_shop_postal_address': shopPostalAddress,
  '20261202_0957_holiday_choices': holidayChoices,
  '20261202_1041_labor_line_basis': laborLineBasis,
  '20261202_1101_build_messages': buildMessages,
  '20261202_1105_reminders': reminders,
  '20261202_1345_booking_deposit_status': bookingDepositStatus,
  '20261202_1405_builds_list_orders': buildsListOrders,
  '20261203_0700_bench_notify': benchNotify,
};
