import { BadRequestException, Controller, Get, HttpCode, Param, ParseUUIDPipe, Post, Query } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { AuthUser, MailLogEntry, MailLogPage } from '@loomwright/shared';
import { CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { ListMailDto } from './dto/list-mail.dto';
import { MailService } from './mail.service';

@ApiTags('mail')
@Controller('mail')
export class MailController {
  constructor(private readonly mail: MailService) {}

  /** The mail log, newest first. */
  @Get()
  @Roles('builder', 'owner')
  list(@Query() query: ListMailDto, @CurrentUser() user: AuthUser): Promise<MailLogPage> {
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
