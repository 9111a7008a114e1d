import { BadRequestException, Body, Controller, Get, HttpCode, Param, ParseUUIDPipe, Post } from '@nestjs/common';
import { ApiCookieAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { AcceptBookingResponse, AuthUser, BookingDetail, BookingStateResponse, ExtraView, IntakeItemView, TimeEntriesResponse } from '@loomwright/shared';
import { CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { BuildRecordsService } from './build-records.service';
import { BuildsService } from './builds.service';
import { AcceptBookingDto } from './dto/accept-booking.dto';
import { ChangeStateDto } from './dto/change-state.dto';
import { CreateTimeEntryDto } from './dto/create-time-entry.dto';
import { DecideExtraDto } from './dto/decide-extra.dto';
import { DeclineBookingDto } from './dto/decline-booking.dto';
import { ProposeExtraDto } from './dto/propose-extra.dto';
import { RecordIntakeDto } from './dto/record-intake.dto';
import { LayoutNoteDto } from './dto/request-layout.dto';
import { WaiveBalanceDto } from './dto/waive-balance.dto';

const bookingId = new ParseUUIDPipe({ exceptionFactory: () => new BadRequestException('The booking id in the address must be a UUID.') });

/** A build's life on the bench, from acceptance to delivery. */
@ApiTags('builds')
@ApiCookieAuth('lw_session')
@Controller('bookings/:id')
export class BuildsController {
  constructor(
    private readonly builds: BuildsService,
    private readonly records: BuildRecordsService,
  ) {}

  @Post('accept')
  @HttpCode(200)
  @Roles('builder', 'owner')
  @ApiOkResponse({ description: 'Scheduled: bench time taken, firm quote written, the player e-mailed.' })
  accept(@CurrentUser() user: AuthUser, @Param('id', bookingId) id: string, @Body() dto: AcceptBookingDto): Promise<AcceptBookingResponse> {
    return this.builds.accept(user, id, dto);
  }

  @Post('decline')
  @HttpCode(200)
  @Roles('builder', 'owner')
  decline(@CurrentUser() user: AuthUser, @Param('id', bookingId) id: string, @Body() dto: DeclineBookingDto): Promise<BookingDetail> {
    return this.builds.decline(user, id, dto.reason);
  }

  @Post('state')
  @HttpCode(200)
  @Roles('builder', 'owner')
  changeState(@CurrentUser() user: AuthUser, @Param('id', bookingId) id: string, @Body() dto: ChangeStateDto): Promise<BookingStateResponse> {
    return this.builds.changeState(user, id, dto.to, dto.note);
  }

  @Post('waive-balance')
  @HttpCode(200)
  @Roles('owner')
  waiveBalance(@CurrentUser() user: AuthUser, @Param('id', bookingId) id: string, @Body() dto: WaiveBalanceDto): Promise<BookingStateResponse> {
    return this.builds.waiveBalance(user, id, dto.reason);
  }

  @Post('time-entries')
  @Roles('builder', 'owner')
  addTimeEntry(@CurrentUser() user: AuthUser, @Param('id', bookingId) id: string, @Body() dto: CreateTimeEntryDto): Promise<TimeEntriesResponse> {
    return this.records.addTimeEntry(user, id, dto);
  }

  @Get('time-entries')
  @Roles('builder', 'owner')
  timeEntries(@Param('id', bookingId) id: string): Promise<TimeEntriesResponse> {
    return this.records.timeEntries(id);
  }

  @Post('intake')
  @Roles('builder', 'owner')
  recordIntake(@CurrentUser() user: AuthUser, @Param('id', bookingId) id: string, @Body() dto: RecordIntakeDto): Promise<IntakeItemView[]> {
    return this.records.recordIntake(user, id, dto);
  }

  @Get('intake')
  @Roles('builder', 'owner')
  intake(@Param('id', bookingId) id: string): Promise<IntakeItemView[]> {
    return this.records.intake(id);
  }

  @Post('extras')
  @Roles('owner')
  proposeExtra(@CurrentUser() user: AuthUser, @Param('id', bookingId) id: string, @Body() dto: ProposeExtraDto): Promise<ExtraView> {
    return this.records.proposeExtra(user, id, dto);
  }

  @Get('extras')
  @Roles('customer', 'builder', 'owner')
  extras(@CurrentUser() user: AuthUser, @Param('id', bookingId) id: string): Promise<ExtraView[]> {
    return this.records.extras(user, id);
  }

  @Post('extras/:extraId/decision')
  @HttpCode(200)
  @Roles('customer')
  decideExtra(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingId) id: string,
    @Param('extraId', new ParseUUIDPipe({ exceptionFactory: () => new BadRequestException('The extra id in the address must be a UUID.') }))
    extraId: string,
    @Body() dto: DecideExtraDto,
  ): Promise<ExtraView> {
    return this.records.decideExtra(user, id, extraId, dto.approve);
  }

  @Post('layout/request')
  @HttpCode(200)
  @Roles('builder', 'owner')
  requestLayout(@CurrentUser() user: AuthUser, @Param('id', bookingId) id: string, @Body() dto: LayoutNoteDto): Promise<BookingStateResponse> {
    return this.records.requestLayoutApproval(user, id, dto.note);
  }

  @Post('layout/approve')
  @HttpCode(200)
  @Roles('customer')
  approveLayout(@CurrentUser() user: AuthUser, @Param('id', bookingId) id: string, @Body() dto: LayoutNoteDto): Promise<BookingStateResponse> {
    return this.records.approveLayout(user, id, dto.note);
  }
}
