import { Module } from '@nestjs/common';
import { BenchModule } from '../bench/bench.module';
import { BookingsModule } from '../bookings/bookings.module';
import { MailModule } from '../mail/mail.module';
import { PaymentsModule } from '../payments/payments.module';
import { ShopModule } from '../shop/shop.module';
import { ApprovalsService } from './approvals.service';
import { BenchChangesController } from './bench-changes.controller';
import { BenchChangesService } from './bench-changes.service';
import { BuildHistory } from './build-history';
import { BuildRecordsService } from './build-records.service';
import { BuildsController } from './builds.controller';
import { BuildsRepository } from './builds.repository';
import { BuildsService } from './builds.service';

@Module({
  imports: [BenchModule, BookingsModule, MailModule, PaymentsModule, ShopModule],
  controllers: [BuildsController, BenchChangesController],
  providers: [BuildsService, BuildRecordsService, ApprovalsService, BenchChangesService, BuildsRepository, BuildHistory],
  exports: [BuildsService, BuildsRepository],
})
export class BuildsModule {}
