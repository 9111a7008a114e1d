import { ApiProperty } from '@nestjs/swagger';
import { IsString, MaxLength, MinLength } from 'class-validator';
import { IsCalendarDay } from '../../bench/dto/is-calendar-day';

export class CreateClosureDto {
  @ApiProperty({ example: '2026-12-28' })
  @IsCalendarDay()
  startsOn: string;

  @ApiProperty({ example: '2026-12-31', description: 'Last closed day (inclusive).' })
  @IsCalendarDay()
  endsOn: string;

  @ApiProperty({ example: 'Year-end stocktake' })
  @IsString({ message: 'reason must be text' })
  @MinLength(2, { message: 'reason must say why the shop is closed' })
  @MaxLength(200)
  reason: string;
}
