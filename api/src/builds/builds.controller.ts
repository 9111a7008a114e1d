import { BadRequestException, Body, Controller, Get, HttpCode, Param, ParseUUIDPipe, Post } from '@nestjs/common';
import { ApiCookieAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import {
  acceptBookingSchema,
  changeStateSchema,
  declineBookingSchema,
  decideExtraSchema,
  layoutNoteSchema,
  proposeExtraSchema,
  recordIntakeSchema,
  timeEntrySchema,
  waiveBalanceSchema,
  type AcceptBookingInput,
  type AcceptBookingResponse,
  type AuthUser,
  type BookingDetail,
  type BookingStateResponse,
  type ChangeStateInput,
  type DecideExtraInput,
  type DeclineBookingInput,
  type ExtraView,
  type IntakeItemView,
  type LayoutNoteInput,
  type ProposeExtraInput,
  type RecordIntakeInput,
  type TimeEntriesResponse,
  type TimeEntryInput,
  type WaiveBalanceInput,
} from '@loomwright/shared';
import { CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { ApiZodBody } from '../common/zod-openapi';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
import { BuildRecordsService } from './build-records.service';
import { BuildsService } from './builds.service';
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
  @ApiZodBody(acceptBookingSchema)
  accept(@CurrentUser() user: AuthUser, @Param('id', bookingId) id: string, @Body(new ZodValidationPipe(acceptBookingSchema)) dto: AcceptBookingInput): Promise<AcceptBookingResponse> {
    return this.builds.accept(user, id, dto);
  }

  @Post('decline')
  @HttpCode(200)
  @Roles('builder', 'owner')
  @ApiZodBody(declineBookingSchema)
  decline(@CurrentUser() user: AuthUser, @Param('id', bookingId) id: string, @Body(new ZodValidationPipe(declineBookingSchema)) dto: DeclineBookingInput): Promise<BookingDetail> {
    return this.builds.decline(user, id, dto.reason);
  }

  @Post('state')
  @HttpCode(200)
  @Roles('builder', 'owner')
  @ApiZodBody(changeStateSchema)
  changeState(@CurrentUser() user: AuthUser, @Param('id', bookingId) id: string, @Body(new ZodValidationPipe(changeStateSchema)) dto: ChangeStateInput): Promise<BookingStateResponse> {
    return this.builds.changeState(user, id, dto.to, dto.note);
  }

  @Post('waive-balance')
  @HttpCode(200)
  @Roles('owner')
  @ApiZodBody(waiveBalanceSchema)
  waiveBalance(@CurrentUser() user: AuthUser, @Param('id', bookingId) id: string, @Body(new ZodValidationPipe(waiveBalanceSchema)) dto: WaiveBalanceInput): Promise<BookingStateResponse> {
    return this.builds.waiveBalance(user, id, dto.reason);
  }

  @Post('time-entries')
  @Roles('builder', 'owner')
  @ApiZodBody(timeEntrySchema)
  addTimeEntry(@CurrentUser() user: AuthUser, @Param('id', bookingId) id: string, @Body(new ZodValidationPipe(timeEntrySchema)) dto: TimeEntryInput): Promise<TimeEntriesResponse> {
    return this.records.addTimeEntry(user, id, dto);
  }

  @Get('time-entries')
  @Roles('builder', 'owner')
  timeEntries(@Param('id', bookingId) id: string): Promise<TimeEntriesResponse> {
    return this.records.timeEntries(id);
  }

  @Post('intake')
  @Roles('builder', 'owner')
  @ApiZodBody(recordIntakeSchema)
  recordIntake(@CurrentUser() user: AuthUser, @Param('id', bookingId) id: string, @Body(new ZodValidationPipe(recordIntakeSchema)) dto: RecordIntakeInput): Promise<IntakeItemView[]> {
    return this.records.recordIntake(user, id, dto);
  }

  @Get('intake')
  @Roles('builder', 'owner')
  intake(@Param('id', bookingId) id: string): Promise<IntakeItemView[]> {
    return this.records.intake(id);
  }

  @Post('extras')
  @Roles('owner')
  @ApiZodBody(proposeExtraSchema)
  proposeExtra(@CurrentUser() user: AuthUser, @Param('id', bookingId) id: string, @Body(new ZodValidationPipe(proposeExtraSchema)) dto: ProposeExtraInput): Promise<ExtraView> {
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
  @ApiZodBody(decideExtraSchema)
  decideExtra(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingId) id: string,
    @Param('extraId', new ParseUUIDPipe({ exceptionFactory: () => new BadRequestException('The extra id in the address must be a UUID.') }))
    extraId: string,
    @Body(new ZodValidationPipe(decideExtraSchema)) dto: DecideExtraInput,
  ): Promise<ExtraView> {
    return this.records.decideExtra(user, id, extraId, dto.approve);
  }

  @Post('layout/request')
  @HttpCode(200)
  @Roles('builder', 'owner')
  @ApiZodBody(layoutNoteSchema)
  requestLayout(@CurrentUser() user: AuthUser, @Param('id', bookingId) id: string, @Body(new ZodValidationPipe(layoutNoteSchema)) dto: LayoutNoteInput): Promise<BookingStateResponse> {
    return this.records.requestLayoutApproval(user, id, dto.note);
  }

  @Post('layout/approve')
  @HttpCode(200)
  @Roles('customer')
  approveLayout(@CurrentUser() user: AuthUser, @Param('id', bookingId) id: string, @Body(new ZodValidationPipe(layoutNoteSchema)) dto: LayoutNoteInput): Promise<BookingStateResponse> {
    return this.records.approveLayout(user, id, dto.note);
  }
}
