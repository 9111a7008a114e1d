import path from 'node:path';
import { Module } from '@nestjs/common';
import { ConfigModule } from '@nestjs/config';
import { ServeStaticModule } from '@nestjs/serve-static';
import { AuthModule } from './auth/auth.module';
import { BenchModule } from './bench/bench.module';
import { BuildsModule } from './builds/builds.module';
import { CustomersModule } from './customers/customers.module';
import { SettingsModule } from './settings/settings.module';
import { TeamModule } from './team/team.module';
import { BookingsModule } from './bookings/bookings.module';
import { BuildSheetsModule } from './build-sheets/build-sheets.module';
import { ConfigurationsModule } from './configurations/configurations.module';
import { configuration } from './config/configuration';
import { DatabaseModule } from './database/database.module';
import { EstimatesModule } from './estimates/estimates.module';
import { ExportsModule } from './exports/exports.module';
import { ReportsModule } from './reports/reports.module';
import { MessagesModule } from './messages/messages.module';
import { CalendarFeedsModule } from './calendar-feeds/calendar-feeds.module';
import { TodayModule } from './today/today.module';
import { QuotesModule } from './quotes/quotes.module';
import { RemindersModule } from './reminders/reminders.module';
import { HealthModule } from './health/health.module';
import { InvitationsModule } from './invitations/invitations.module';
import { LoggingModule } from './logging/logging.module';
import { MetricsModule } from './metrics/metrics.module';
import { MailModule } from './mail/mail.module';
import { PaymentsModule } from './payments/payments.module';
import { PriceBookModule } from './price-book/price-book.module';
import { SecurityModule } from './security/security.module';
import { ShopModule } from './shop/shop.module';
import { storefrontPageFiles } from './storefront/storefront-pages';

// api/dist/src once built, api/src under the tests: the repository is above api/ either way.
const repoRoot = path.resolve(__dirname, path.basename(path.dirname(__dirname)) === 'dist' ? '../../..' : '../..');
const servesApps = process.env.SERVE_APPS !== 'false';
/** The storefront's build, served at `/` (app.setup.ts puts its real-404 guard in front). */
export const storefrontDist = path.join(repoRoot, 'storefront', 'dist');

/**
 * Vite names every built script and style by its content hash, so a browser may keep them for a
 * year; index.html, which names the current ones, is asked for again each time.
 */
export function cacheHashedAssets(res: { setHeader(name: string, value: string): void }, filePath: string) {
  if (filePath.includes(`${path.sep}assets${path.sep}`)) res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
  else res.setHeader('Cache-Control', 'no-cache');
}

@Module({
  imports: [
    ConfigModule.forRoot({ isGlobal: true, load: [configuration], ignoreEnvFile: true }),
    LoggingModule,
    DatabaseModule,
    MetricsModule,
    // Before AuthModule: its CSRF guard must run ahead of the sign-in and role guards.
    SecurityModule,
    ...(servesApps
      ? [
          // The backoffice first, so its client-side routes fall back to its own index.html.
          ServeStaticModule.forRoot(
            {
              rootPath: path.join(repoRoot, 'backoffice', 'dist'),
              serveRoot: '/backoffice',
              exclude: ['/api/{*path}'],
              serveStaticOptions: { setHeaders: cacheHashedAssets },
            },
            {
              rootPath: storefrontDist,
              exclude: ['/api/{*path}', '/backoffice/{*path}'],
              serveStaticOptions: { setHeaders: cacheHashedAssets, ...storefrontPageFiles },
            },
          ),
        ]
      : []),
    AuthModule,
    BookingsModule,
    HealthModule,
    InvitationsModule,
    MailModule,
    PaymentsModule,
    ShopModule,
    BenchModule,
    BuildsModule,
    TeamModule,
    SettingsModule,
    CustomersModule,
    PriceBookModule,
    EstimatesModule,
    QuotesModule,
    BuildSheetsModule,
    ExportsModule,
    ReportsModule,
    MessagesModule,
    CalendarFeedsModule,
    TodayModule,
    ConfigurationsModule,
    RemindersModule,
  ],
})
export class AppModule {}
