import { Module } from '@nestjs/common';
import { OfficeRepository } from '../exports/office.repository';
import { TodayController } from './today.controller';
import { TodayService } from './today.service';

/** A builder's today (GET /api/today); reads money through the exports' OfficeRepository like the reports do. */
@Module({ controllers: [TodayController], providers: [TodayService, OfficeRepository] })
export class TodayModule {}
