import { responseSchemas } from '@loomwright/shared/dist/response-schemas';
import { Body, Controller, Get, HttpCode, Param, Post, Query } from '@nestjs/common';
import { uuidParam } from '../common/uuid-param.pipe';
import { ApiCreatedResponse, ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import {
  listMailQuerySchema,
  resendMailSchema,
  type AuthUser,
  type ListMailQuery,
  type MailLogEntry,
  type MailLogPage,
  type ResendMailInput,
  requestWords,
} from '@loomwright/shared';
import { CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { ApiZodBody, ApiZodQuery, ApiZodResponse } from '../common/zod-openapi';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
import { MailService } from './mail.service';
import { ApiErrorCodes } from '../common/api-document';

@ApiTags('mail')
@Controller('mail')
export class MailController {
  constructor(private readonly mail: MailService) {}

  /** The mail log, newest first. */
  @ApiOperation({ summary: 'List the mail log' })
  @Get()
  @Roles('builder', 'owner')
  @ApiZodQuery(listMailQuerySchema)
  @ApiZodResponse(responseSchemas.mailLogPageSchema)
  @ApiOkResponse({ description: 'The mail log, newest first, a page at a time; canResend says whether the signed-in person may resend.' })
  list(@Query(new ZodValidationPipe(listMailQuerySchema)) query: ListMailQuery, @CurrentUser() user: AuthUser): Promise<MailLogPage> {
    return this.mail.list({ ...query, q: query.q?.trim() || undefined }, user);
  }

  @ApiOperation({ summary: 'Send a message again' })
  @ApiErrorCodes('conflict')
  @Post(':id/resend')
  @Roles('owner')
  @HttpCode(201)
  @ApiZodBody(
    resendMailSchema.unwrap(),
    'Optional; confirmPossibleDuplicate: true is required to resend a message whose outcome is unknown.',
  )
  @ApiZodResponse(responseSchemas.mailLogEntrySchema)
  @ApiCreatedResponse({
    description:
      'The new message; a single-use link in it is a fresh one. 409 in words when the outcome of the original is unknown and not confirmed.',
  })
  resend(
    @Param('id', uuidParam(requestWords.notAnId('a message in the mail log'))) id: string,
    @Body(new ZodValidationPipe(resendMailSchema)) body: ResendMailInput,
  ): Promise<MailLogEntry> {
    return this.mail.resend(id, body ?? {});
  }
}
