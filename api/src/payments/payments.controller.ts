import { responseSchemas } from '@loomwright/shared/dist/response-schemas';
import { Body, Controller, Headers, HttpCode, Param, Post, Req, type RawBodyRequest } from '@nestjs/common';
import { ApiConsumes, ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import {
  cancelBookingSchema,
  recordBalanceSchema,
  refundDepositSchema,
  releaseDisputeSchema,
  type AuthUser,
  type BookingDetail,
  type CheckoutOpened,
  type PaymentEventReceived,
  type CancelBookingInput,
  type RecordBalanceInput,
  type RefundDepositInput,
  type ReleaseDisputeInput,
} from '@loomwright/shared';
import type { Request } from 'express';
import { CurrentUser } from '../auth/current-user.decorator';
import { Public } from '../auth/public.decorator';
import { Roles } from '../auth/roles.decorator';
import { AllowCrossSite } from '../security/allow-cross-site.decorator';
import { bookingIdPipe } from '../bookings/booking-id.pipe';
import { ApiZodBody, ApiZodResponse } from '../common/zod-openapi';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
import { PaymentWebhooksService } from './payment-webhooks.service';
import { PaymentsService } from './payments.service';
import { ApiErrorCodes } from '../common/api-document';

@ApiTags('payments')
@Controller()
export class PaymentsController {
  constructor(
    private readonly payments: PaymentsService,
    private readonly webhooks: PaymentWebhooksService,
  ) {}

  @ApiOperation({ summary: 'Open the hosted checkout for what is due' })
  @ApiZodResponse(responseSchemas.checkoutOpenedSchema)
  @ApiErrorCodes('nothing_due', 'payment_settling')
  @Post('bookings/:id/checkout')
  @Roles('customer')
  @HttpCode(200)
  @ApiOkResponse({ description: '{ url } of the hosted checkout for what is due (deposit, later balance); the same session on repeat.' })
  async checkout(@CurrentUser() user: AuthUser, @Param('id', bookingIdPipe) id: string): Promise<CheckoutOpened> {
    const { url } = await this.payments.checkout(user, id);
    return { url };
  }

  @ApiOperation({ summary: 'Cancel a request before it is scheduled' })
  @ApiErrorCodes('too_late_to_cancel', 'deposit_disputed')
  @Post('bookings/:id/cancel')
  @Roles('customer')
  @HttpCode(200)
  @ApiOkResponse({ description: 'Cancels a request before it is scheduled; a paid deposit is refunded.' })
  @ApiZodBody(cancelBookingSchema)
  @ApiZodResponse(responseSchemas.bookingDetailSchema)
  cancel(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingIdPipe) id: string,
    @Body(new ZodValidationPipe(cancelBookingSchema)) dto: CancelBookingInput,
  ): Promise<BookingDetail> {
    return this.payments.cancel(user, id, dto.reason);
  }

  @ApiOperation({ summary: 'Refund a paid deposit' })
  @ApiErrorCodes('conflict', 'nothing_due', 'deposit_disputed')
  @Post('bookings/:id/refund')
  @Roles('owner')
  @HttpCode(200)
  @ApiOkResponse({ description: "Refunds the booking's paid deposit through the payment provider." })
  @ApiZodBody(refundDepositSchema)
  @ApiZodResponse(responseSchemas.bookingDetailSchema)
  refund(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingIdPipe) id: string,
    @Body(new ZodValidationPipe(refundDepositSchema)) dto: RefundDepositInput,
  ): Promise<BookingDetail> {
    return this.payments.refundByOwner(user, id, dto.reason);
  }

  @ApiOperation({ summary: 'Record the balance taken in person' })
  @ApiZodResponse(responseSchemas.bookingDetailSchema)
  @ApiErrorCodes('bad_request', 'conflict', 'nothing_due')
  @Post('bookings/:id/balance/record')
  @Roles('owner')
  @HttpCode(200)
  @ApiZodBody(recordBalanceSchema)
  @ApiOkResponse({
    description: 'Records the whole balance taken in person (cash, card terminal, bank transfer); closes any open balance checkout.',
  })
  recordBalance(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingIdPipe) id: string,
    @Body(new ZodValidationPipe(recordBalanceSchema)) body: RecordBalanceInput,
  ) {
    return this.payments.recordBalance(user, id, body);
  }

  @ApiOperation({ summary: 'E-mail the player the balance due' })
  @ApiZodResponse(responseSchemas.bookingDetailSchema)
  @ApiErrorCodes('conflict', 'nothing_due')
  @Post('bookings/:id/balance/request')
  @Roles('builder', 'owner')
  @HttpCode(200)
  @ApiOkResponse({ description: 'E-mails the player the balance due again (at most once a minute).' })
  requestBalance(@CurrentUser() user: AuthUser, @Param('id', bookingIdPipe) id: string) {
    return this.payments.requestBalance(user, id);
  }

  @ApiOperation({ summary: 'Release a disputed build for delivery' })
  @ApiErrorCodes('conflict')
  @Post('bookings/:id/dispute/release')
  @Roles('owner')
  @HttpCode(200)
  @ApiOkResponse({ description: 'The owner lets a build whose payment was disputed be delivered; the note goes on the timeline.' })
  @ApiZodBody(releaseDisputeSchema)
  @ApiZodResponse(responseSchemas.bookingDetailSchema)
  releaseDispute(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingIdPipe) id: string,
    @Body(new ZodValidationPipe(releaseDisputeSchema)) body: ReleaseDisputeInput,
  ): Promise<BookingDetail> {
    return this.payments.releaseDispute(user, id, body.note);
  }

  @Public()
  @AllowCrossSite() // signed by the provider; its servers send no Origin of ours
  @ApiConsumes('application/json')
  @ApiOperation({ summary: 'Receive a signed payment provider event' })
  @ApiErrorCodes('bad_request')
  @Post('payments/webhook')
  @HttpCode(200)
  @ApiZodResponse(responseSchemas.paymentEventReceivedSchema)
  @ApiOkResponse({
    description:
      'Signed events from the payment provider; a bad signature gets 400. An event taken before answers duplicate: true and changes nothing.',
  })
  webhook(@Req() req: RawBodyRequest<Request>, @Headers('stripe-signature') signature: string | undefined): Promise<PaymentEventReceived> {
    const event = this.webhooks.verify(req.rawBody, signature);
    return this.webhooks.handle(event);
  }
}
