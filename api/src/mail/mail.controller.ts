import { BadRequestException, Controller, Get, HttpCode, Param, ParseUUIDPipe, Post, Query } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import { listMailQuerySchema, type AuthUser, type ListMailQuery, type MailLogEntry, type MailLogPage } from '@loomwright/shared';
import { CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { ApiZodQuery } from '../common/zod-openapi';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
import { MailService } from './mail.service';

@ApiTags('mail')
@Controller('mail')
export class MailController {
  constructor(private readonly mail: MailService) {}

  /** The mail log, newest first. */
  @Get()
  @Roles('builder', 'owner')
  @ApiZodQuery(listMailQuerySchema)
  list(@Query(new ZodValidationPipe(listMailQuerySchema)) query: ListMailQuery, @CurrentUser() user: AuthUser): Promise<MailLogPage> {
    return this.mail.list({ ...query, q: query.q?.trim() || undefined }, user.role === 'owner');
  }

  @Post(':id/resend')
  @Roles('owner')
  @HttpCode(201)
  resend(
    @Param('id', new ParseUUIDPipe({ exceptionFactory: () => new BadIdException() })) id: string,
  ): Promise<MailLogEntry> {
    return this.mail.resend(id);
  }
}

class BadIdException extends BadRequestException {
  constructor() {
    super('The message id must be a UUID, as listed in the mail log.');
  }
}
