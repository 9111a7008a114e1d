import { Controller, Get, Query } from '@nestjs/common';
import { ApiCookieAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { AuthUser, BenchSuggestResponse, BenchView } from '@loomwright/shared';
import { CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { BenchService } from './bench.service';
import { GetBenchDto } from './dto/get-bench.dto';
import { SuggestBenchDto } from './dto/suggest-bench.dto';

@ApiTags('bench')
@ApiCookieAuth('lw_session')
@Roles('builder', 'owner')
@Controller('bench')
export class BenchController {
  constructor(private readonly bench: BenchService) {}

  @Get()
  @ApiOkResponse({ description: 'Per builder per day: capacity, booked hours and the builds on that day (the signed-in builder first).' })
  view(@CurrentUser() user: AuthUser, @Query() query: GetBenchDto): Promise<BenchView> {
    return this.bench.view(user, query);
  }

  @Get('suggest')
  @ApiOkResponse({ description: 'The earliest bench date per eligible builder that holds the build, with the expected completion.' })
  suggest(@CurrentUser() user: AuthUser, @Query() query: SuggestBenchDto): Promise<BenchSuggestResponse> {
    return this.bench.suggest(user, query.bookingId, query.builderId);
  }
}
