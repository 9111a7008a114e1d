import { responseSchemas } from '@loomwright/shared/dist/response-schemas';
import { Body, Controller, Get, HttpCode, Param, Post } from '@nestjs/common';
import { uuidParam } from '../common/uuid-param.pipe';
import { ApiCookieAuth, ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import {
  benchDateErrorCodes,
  cancelScheduledSchema,
  priceConsentSchema,
  rescheduleSchema,
  type AuthUser,
  type BookingDetail,
  type CancelScheduledInput,
  type CancellationPreview,
  type PriceConsentInput,
  type RescheduleInput,
  type RescheduleResponse,
  requestWords,
} from '@loomwright/shared';
import { CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { ApiZodBody, ApiZodResponse } from '../common/zod-openapi';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
import { BenchChangesService } from './bench-changes.service';
import { ApiErrorCodes } from '../common/api-document';

const bookingId = uuidParam(requestWords.notAnId('a booking'));

/** When plans change after acceptance: move, reassign, cancel, and the player's answer to a new price. */
@ApiTags('builds')
@ApiCookieAuth('lw_session')
@Controller('bookings/:id')
export class BenchChangesController {
  constructor(private readonly changes: BenchChangesService) {}

  @ApiOperation({ summary: 'Move a build to another day or builder' })
  @ApiZodResponse(responseSchemas.rescheduleResponseSchema)
  @ApiErrorCodes('bad_request', 'forbidden', 'conflict', ...benchDateErrorCodes)
  @Post('reschedule')
  @HttpCode(200)
  @ApiZodBody(rescheduleSchema)
  @Roles('builder', 'owner')
  @ApiOkResponse({
    description: 'The build moved to another day and/or builder; history written, the player e-mailed an updated calendar file.',
  })
  reschedule(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingId) id: string,
    @Body(new ZodValidationPipe(rescheduleSchema)) body: RescheduleInput,
  ): Promise<RescheduleResponse> {
    return this.changes.reschedule(user, id, body);
  }

  @ApiOperation({ summary: 'What cancelling a build would refund' })
  @ApiZodResponse(responseSchemas.cancellationPreviewSchema)
  @Get('cancellation')
  @Roles('owner')
  @ApiOkResponse({ description: 'What cancelling this build would refund, per cause, and the deposit policy behind it.' })
  cancellation(@Param('id', bookingId) id: string): Promise<CancellationPreview> {
    return this.changes.cancellationPreview(id);
  }

  @ApiOperation({ summary: 'Cancel a scheduled build' })
  @ApiZodResponse(responseSchemas.bookingDetailSchema)
  @ApiErrorCodes('conflict', 'too_late_to_cancel', 'deposit_disputed')
  @Post('cancel-scheduled')
  @HttpCode(200)
  @ApiZodBody(cancelScheduledSchema)
  @Roles('owner')
  @ApiOkResponse({
    description: 'Cancelled: bench time released, deposit refunded per the policy, the player e-mailed a calendar cancellation.',
  })
  cancelScheduled(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingId) id: string,
    @Body(new ZodValidationPipe(cancelScheduledSchema)) body: CancelScheduledInput,
  ): Promise<BookingDetail> {
    return this.changes.cancelScheduled(user, id, body);
  }

  @ApiOperation({ summary: 'Answer a firm price above the estimate' })
  @ApiZodResponse(responseSchemas.bookingDetailSchema)
  @ApiErrorCodes('conflict', 'too_late_to_cancel', 'deposit_disputed')
  @Post('price-consent')
  @HttpCode(200)
  @ApiZodBody(priceConsentSchema)
  @Roles('customer')
  @ApiOkResponse({ description: 'The player agrees to a firm price above their estimate, or cancels with the whole deposit back.' })
  priceConsent(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingId) id: string,
    @Body(new ZodValidationPipe(priceConsentSchema)) body: PriceConsentInput,
  ): Promise<BookingDetail> {
    return this.changes.decidePrice(user, id, body.accept);
  }
}
