import { z } from 'zod';
import { responseSchemas } from '@loomwright/shared/dist/response-schemas';
import { Body, Controller, Delete, Get, HttpCode, Param, Patch, Post } from '@nestjs/common';
import { uuidParam } from '../common/uuid-param.pipe';
import { ApiCookieAuth, ApiCreatedResponse, ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import {
  benchDateErrorCodes,
  acceptBookingSchema,
  changeStateSchema,
  declineBookingSchema,
  decideExtraSchema,
  editIntakeItemSchema,
  editTimeEntrySchema,
  layoutNoteSchema,
  layoutRequestSchema,
  proposeExtraSchema,
  recordedDecisionSchema,
  recordIntakeSchema,
  staffNoteSchema,
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
  type EditIntakeItemInput,
  type EditTimeEntryInput,
  type ExtraView,
  type IntakeItemView,
  type LayoutNoteInput,
  type LayoutRequestInput,
  type ProposeExtraInput,
  type RecordedDecisionInput,
  type RecordIntakeInput,
  type StaffNoteAdded,
  type StaffNoteInput,
  type TimeEntriesResponse,
  type TimeEntryInput,
  type WaiveBalanceInput,
  requestWords,
} from '@loomwright/shared';
import { CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { ApiZodBody, ApiZodResponse } from '../common/zod-openapi';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
import { ApprovalsService } from './approvals.service';
import { BuildRecordsService } from './build-records.service';
import { BuildsService } from './builds.service';
import { ApiErrorCodes } from '../common/api-document';

const bookingId = uuidParam(requestWords.notAnId('a booking'));
const uuid = (_name: string, what: string) => uuidParam(requestWords.notAnId(what));

/** A build's life on the bench, from acceptance to delivery. */
@ApiTags('builds')
@ApiCookieAuth('lw_session')
@Controller('bookings/:id')
export class BuildsController {
  constructor(
    private readonly builds: BuildsService,
    private readonly records: BuildRecordsService,
    private readonly approvals: ApprovalsService,
  ) {}

  @ApiOperation({ summary: 'Accept a request at a bench date' })
  @ApiZodResponse(responseSchemas.acceptBookingResponseSchema)
  @ApiErrorCodes('bad_request', 'forbidden', 'conflict', ...benchDateErrorCodes)
  @Post('accept')
  @HttpCode(200)
  @Roles('builder', 'owner')
  @ApiOkResponse({ description: 'Scheduled: bench time taken, firm quote written, the player e-mailed.' })
  @ApiZodBody(acceptBookingSchema)
  accept(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingId) id: string,
    @Body(new ZodValidationPipe(acceptBookingSchema)) dto: AcceptBookingInput,
  ): Promise<AcceptBookingResponse> {
    return this.builds.accept(user, id, dto);
  }

  @ApiOperation({ summary: 'Decline a request' })
  @ApiZodResponse(responseSchemas.bookingDetailSchema)
  @ApiErrorCodes('forbidden', 'conflict', 'deposit_disputed')
  @Post('decline')
  @HttpCode(200)
  @Roles('builder', 'owner')
  @ApiZodBody(declineBookingSchema)
  decline(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingId) id: string,
    @Body(new ZodValidationPipe(declineBookingSchema)) dto: DeclineBookingInput,
  ): Promise<BookingDetail> {
    return this.builds.decline(user, id, dto.reason);
  }

  @ApiOperation({ summary: 'Move a build on' })
  @ApiZodResponse(responseSchemas.bookingStateResponseSchema)
  @ApiErrorCodes('conflict')
  @Post('state')
  @HttpCode(200)
  @Roles('builder', 'owner')
  @ApiZodBody(changeStateSchema)
  changeState(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingId) id: string,
    @Body(new ZodValidationPipe(changeStateSchema)) dto: ChangeStateInput,
  ): Promise<BookingStateResponse> {
    return this.builds.changeState(user, id, dto.to, dto.note ?? '', !!dto.tellPlayer);
  }

  @ApiOperation({ summary: 'Waive the balance of a build' })
  @ApiZodResponse(responseSchemas.bookingStateResponseSchema)
  @ApiErrorCodes('conflict')
  @Post('waive-balance')
  @HttpCode(200)
  @Roles('owner')
  @ApiZodBody(waiveBalanceSchema)
  waiveBalance(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingId) id: string,
    @Body(new ZodValidationPipe(waiveBalanceSchema)) dto: WaiveBalanceInput,
  ): Promise<BookingStateResponse> {
    return this.builds.waiveBalance(user, id, dto.reason);
  }

  @ApiOperation({ summary: 'Add a staff note to the history' })
  @Post('notes')
  @Roles('builder', 'owner')
  @ApiZodBody(staffNoteSchema)
  @ApiZodResponse(responseSchemas.staffNoteAddedSchema)
  @ApiCreatedResponse({
    description: 'A staff note in the history: internal, unless tellPlayer (then e-mailed to the player word for word).',
  })
  addNote(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingId) id: string,
    @Body(new ZodValidationPipe(staffNoteSchema)) body: StaffNoteInput,
  ): Promise<StaffNoteAdded> {
    return this.records.addNote(user, id, body);
  }

  @ApiOperation({ summary: 'Record bench hours' })
  @ApiZodResponse(responseSchemas.timeEntriesResponseSchema)
  @ApiErrorCodes('bad_request', 'forbidden', 'conflict')
  @Post('time-entries')
  @Roles('builder', 'owner')
  @ApiZodBody(timeEntrySchema)
  addTimeEntry(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingId) id: string,
    @Body(new ZodValidationPipe(timeEntrySchema)) body: TimeEntryInput,
  ): Promise<TimeEntriesResponse> {
    return this.records.addTimeEntry(user, id, body);
  }

  @ApiOperation({ summary: 'List a build’s hour entries' })
  @ApiZodResponse(responseSchemas.timeEntriesResponseSchema)
  @Get('time-entries')
  @Roles('builder', 'owner')
  timeEntries(@Param('id', bookingId) id: string): Promise<TimeEntriesResponse> {
    return this.records.timeEntries(id);
  }

  @ApiOperation({ summary: 'Correct an hour entry' })
  @ApiZodResponse(responseSchemas.timeEntriesResponseSchema)
  @ApiErrorCodes('bad_request', 'forbidden', 'conflict')
  @Patch('time-entries/:entryId')
  @Roles('builder', 'owner')
  @ApiZodBody(editTimeEntrySchema)
  @ApiOkResponse({ description: 'Corrects an hour entry: its author or the owner; the change is kept in the history.' })
  editTimeEntry(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingId) id: string,
    @Param('entryId', uuid('entryId', 'an hour entry id')) entryId: string,
    @Body(new ZodValidationPipe(editTimeEntrySchema)) body: EditTimeEntryInput,
  ): Promise<TimeEntriesResponse> {
    return this.records.editTimeEntry(user, id, entryId, body);
  }

  @ApiOperation({ summary: 'Delete an hour entry' })
  @ApiZodResponse(responseSchemas.timeEntriesResponseSchema)
  @ApiErrorCodes('forbidden', 'conflict')
  @Delete('time-entries/:entryId')
  @Roles('builder', 'owner')
  deleteTimeEntry(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingId) id: string,
    @Param('entryId', uuid('entryId', 'an hour entry id')) entryId: string,
  ): Promise<TimeEntriesResponse> {
    return this.records.deleteTimeEntry(user, id, entryId);
  }

  @ApiOperation({ summary: 'Record the pedals received' })
  @ApiZodResponse(z.array(responseSchemas.intakeItemViewSchema))
  @ApiErrorCodes('bad_request', 'conflict')
  @Post('intake')
  @Roles('builder', 'owner')
  @ApiZodBody(recordIntakeSchema)
  @ApiOkResponse({ description: 'Each item once, in signal-chain order; recording an item again corrects it, never duplicates it.' })
  recordIntake(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingId) id: string,
    @Body(new ZodValidationPipe(recordIntakeSchema)) body: RecordIntakeInput,
  ): Promise<IntakeItemView[]> {
    return this.records.recordIntake(user, id, body);
  }

  @ApiOperation({ summary: 'The intake checklist of a build' })
  @ApiZodResponse(z.array(responseSchemas.intakeItemViewSchema))
  @Get('intake')
  @Roles('builder', 'owner')
  intake(@Param('id', bookingId) id: string): Promise<IntakeItemView[]> {
    return this.records.intake(id);
  }

  @ApiOperation({ summary: 'Correct an intake item' })
  @ApiZodResponse(z.array(responseSchemas.intakeItemViewSchema))
  @ApiErrorCodes('conflict')
  @Patch('intake/:itemId')
  @Roles('builder', 'owner')
  @ApiZodBody(editIntakeItemSchema)
  editIntakeItem(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingId) id: string,
    @Param('itemId', uuid('itemId', 'an intake item id')) itemId: string,
    @Body(new ZodValidationPipe(editIntakeItemSchema)) body: EditIntakeItemInput,
  ): Promise<IntakeItemView[]> {
    return this.records.editIntakeItem(user, id, itemId, body);
  }

  @ApiOperation({ summary: 'Propose an extra with its price' })
  @ApiZodResponse(responseSchemas.extraViewSchema)
  @ApiErrorCodes('conflict')
  @Post('extras')
  @Roles('owner')
  @ApiZodBody(proposeExtraSchema)
  @ApiOkResponse({ description: 'Proposes an extra with its price; the player is e-mailed to approve or decline it.' })
  proposeExtra(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingId) id: string,
    @Body(new ZodValidationPipe(proposeExtraSchema)) body: ProposeExtraInput,
  ): Promise<ExtraView> {
    return this.approvals.proposeExtra(user, id, body);
  }

  @ApiOperation({ summary: 'List a build’s extras' })
  @ApiZodResponse(z.array(responseSchemas.extraViewSchema))
  @Get('extras')
  @Roles('customer', 'builder', 'owner')
  extras(@CurrentUser() user: AuthUser, @Param('id', bookingId) id: string): Promise<ExtraView[]> {
    return this.approvals.extras(user, id);
  }

  @ApiOperation({ summary: 'The player approves or declines an extra' })
  @ApiZodResponse(responseSchemas.extraViewSchema)
  @ApiErrorCodes('conflict')
  @Post('extras/:extraId/decision')
  @HttpCode(200)
  @Roles('customer')
  @ApiZodBody(decideExtraSchema)
  @ApiOkResponse({ description: "The booking's player approves or declines an extra, with an optional comment." })
  decideExtra(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingId) id: string,
    @Param('extraId', uuid('extraId', 'an extra id')) extraId: string,
    @Body(new ZodValidationPipe(decideExtraSchema)) body: DecideExtraInput,
  ): Promise<ExtraView> {
    return this.approvals.decideExtra(user, id, extraId, body);
  }

  @ApiOperation({ summary: 'Record the player’s answer on an extra' })
  @ApiZodResponse(responseSchemas.extraViewSchema)
  @ApiErrorCodes('conflict')
  @Post('extras/:extraId/recorded-decision')
  @HttpCode(200)
  @Roles('builder', 'owner')
  @ApiZodBody(recordedDecisionSchema)
  @ApiOkResponse({ description: "Staff record the player's answer given by phone, in person or by e-mail: who gave it and how." })
  recordExtraDecision(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingId) id: string,
    @Param('extraId', uuid('extraId', 'an extra id')) extraId: string,
    @Body(new ZodValidationPipe(recordedDecisionSchema)) body: RecordedDecisionInput,
  ): Promise<ExtraView> {
    return this.approvals.recordExtraDecision(user, id, extraId, body);
  }

  @ApiOperation({ summary: 'Send the layout to the player for approval' })
  @ApiZodResponse(responseSchemas.bookingStateResponseSchema)
  @ApiErrorCodes('conflict')
  @Post('layout/request')
  @HttpCode(200)
  @Roles('builder', 'owner')
  @ApiZodBody(layoutRequestSchema)
  @ApiOkResponse({ description: 'Sends the top-view layout to the player (by e-mail and on their page); testing waits for the answer.' })
  requestLayout(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingId) id: string,
    @Body(new ZodValidationPipe(layoutRequestSchema)) body: LayoutRequestInput,
  ): Promise<BookingStateResponse> {
    return this.approvals.requestLayoutApproval(user, id, body);
  }

  @ApiOperation({ summary: 'The player approves the layout' })
  @ApiZodResponse(responseSchemas.bookingStateResponseSchema)
  @ApiErrorCodes('conflict')
  @Post('layout/approve')
  @HttpCode(200)
  @Roles('customer')
  @ApiZodBody(layoutNoteSchema)
  @ApiOkResponse({ description: 'The player approves the waiting layout (same as layout/decision with approve: true).' })
  approveLayout(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingId) id: string,
    @Body(new ZodValidationPipe(layoutNoteSchema)) body: LayoutNoteInput,
  ): Promise<BookingStateResponse> {
    return this.approvals.decideLayout(user, id, { approve: true, comment: body.note });
  }

  @ApiOperation({ summary: 'The player answers the layout' })
  @ApiZodResponse(responseSchemas.bookingStateResponseSchema)
  @ApiErrorCodes('conflict')
  @Post('layout/decision')
  @HttpCode(200)
  @Roles('customer')
  @ApiZodBody(decideExtraSchema)
  decideLayout(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingId) id: string,
    @Body(new ZodValidationPipe(decideExtraSchema)) body: DecideExtraInput,
  ): Promise<BookingStateResponse> {
    return this.approvals.decideLayout(user, id, body);
  }

  @ApiOperation({ summary: 'Record the player’s answer on the layout' })
  @ApiZodResponse(responseSchemas.bookingStateResponseSchema)
  @ApiErrorCodes('conflict')
  @Post('layout/recorded-decision')
  @HttpCode(200)
  @Roles('builder', 'owner')
  @ApiZodBody(recordedDecisionSchema)
  recordLayoutDecision(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingId) id: string,
    @Body(new ZodValidationPipe(recordedDecisionSchema)) body: RecordedDecisionInput,
  ): Promise<BookingStateResponse> {
    return this.approvals.recordLayoutDecision(user, id, body);
  }
}
