import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsNumber, IsOptional, IsString, IsUUID, Max, MaxLength, Min } from 'class-validator';
import { IsCalendarDay } from '../../bench/dto/is-calendar-day';

export class CreateTimeEntryDto {
  @ApiProperty({ example: '2026-12-14' })
  @IsCalendarDay()
  workedOn: string;

  @ApiProperty({ example: 3.5, description: 'Hours actually spent, in quarter hours or finer (0.01–24).' })
  @IsNumber({ maxDecimalPlaces: 2 }, { message: 'hours must be a number with at most two decimals' })
  @Min(0.01, { message: 'hours must be more than 0' })
  @Max(24, { message: 'hours must be at most 24 for one day' })
  hours: number;

  @ApiPropertyOptional()
  @IsOptional()
  @IsString()
  @MaxLength(1000)
  note?: string;

  @ApiPropertyOptional({ description: 'Owner only: whose hours these are (default the booking’s builder).' })
  @IsOptional()
  @IsUUID('all', { message: 'builderId must be a builder id (a UUID)' })
  builderId?: string;
}
