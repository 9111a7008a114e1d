import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsOptional, IsUUID } from 'class-validator';
import { IsCalendarDay } from './is-calendar-day';

export class GetBenchDto {
  @ApiPropertyOptional({ example: '2026-12-07', description: 'First day shown (default today in the shop time zone).' })
  @IsOptional()
  @IsCalendarDay()
  from?: string;

  @ApiPropertyOptional({ example: '2026-12-20', description: 'Last day shown (default two weeks on); at most 93 days.' })
  @IsOptional()
  @IsCalendarDay()
  to?: string;

  @ApiPropertyOptional({ description: 'Show one builder only.' })
  @IsOptional()
  @IsUUID('all', { message: 'builderId must be a builder id (a UUID)' })
  builderId?: string;
}
