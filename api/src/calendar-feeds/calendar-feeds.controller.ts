import { responseSchemas } from '@loomwright/shared/dist/response-schemas';
import { BadRequestException, Controller, Get, HttpCode, Param, ParseUUIDPipe, Post, Res } from '@nestjs/common';
import type { Response } from 'express';
import { ApiCookieAuth, ApiOkResponse, ApiOperation, ApiProduces, ApiTags } from '@nestjs/swagger';
import { errorResponse, type AuthUser, type CalendarFeedLink } from '@loomwright/shared';
import { z } from 'zod';
import { CurrentUser } from '../auth/current-user.decorator';
import { ApiZodResponse } from '../common/zod-openapi';
import { Public } from '../auth/public.decorator';
import { Roles } from '../auth/roles.decorator';
import { CalendarFeedsService } from './calendar-feeds.service';

const feedId = new ParseUUIDPipe({
  exceptionFactory: () =>
    new BadRequestException(
      errorResponse('invalid_id', 'This calendar link is not one the shop gave out; ask the shop for the current link.'),
    ),
});

@ApiTags('calendar feeds')
@Controller('calendar-feeds')
export class CalendarFeedsController {
  constructor(private readonly feeds: CalendarFeedsService) {}

  @ApiOperation({ summary: 'List the bench calendar feeds' })
  @Get()
  @Roles('owner')
  @ApiCookieAuth('lw_session')
  @ApiZodResponse(z.array(responseSchemas.calendarFeedLinkSchema))
  @ApiOkResponse({ description: 'The secret link of the shop’s bench feed and of every builder’s, to subscribe to in a calendar program.' })
  list(): Promise<CalendarFeedLink[]> {
    return this.feeds.list();
  }

  @ApiOperation({ summary: 'Your own bench calendar feed' })
  @Get('mine')
  @Roles('builder', 'owner')
  @ApiCookieAuth('lw_session')
  @ApiZodResponse(z.array(responseSchemas.calendarFeedLinkSchema))
  @ApiOkResponse({
    description: 'The secret link of the signed-in builder’s own bench feed (an empty list for an account without a bench).',
  })
  mine(@CurrentUser() user: AuthUser): Promise<CalendarFeedLink[]> {
    return this.feeds.mine(user);
  }

  @ApiOperation({ summary: 'Give a calendar feed a new secret link' })
  @Post(':id/rotate')
  @HttpCode(200)
  @Roles('owner')
  @ApiCookieAuth('lw_session')
  @ApiZodResponse(responseSchemas.calendarFeedLinkSchema)
  @ApiOkResponse({ description: 'A new secret link for the feed; the old link answers 404 from now on.' })
  rotate(@Param('id', feedId) id: string, @CurrentUser() user: AuthUser): Promise<CalendarFeedLink> {
    return this.feeds.rotate(id, user);
  }

  @ApiOperation({ summary: 'A bench calendar feed (iCalendar)' })
  @Get(':id/:token/bench.ics')
  @Public()
  @ApiProduces('text/calendar')
  @ApiOkResponse({
    description:
      'The feed as iCalendar (RFC 5545): each scheduled build as an all-day event with reference, player, hours and a link to the build.',
  })
  async calendar(
    @Param('id', feedId) id: string,
    @Param('token') token: string,
    @Res({ passthrough: true }) res: Response,
  ): Promise<string> {
    const text = await this.feeds.calendar(id, token);
    // Set only on success, so a refused link still answers its 404 as JSON in words.
    res.setHeader('Content-Type', 'text/calendar; charset=utf-8');
    res.setHeader('Cache-Control', 'private, no-store');
    return text;
  }
}
