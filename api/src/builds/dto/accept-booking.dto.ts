import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsNotEmpty, IsOptional, IsString, IsUUID, MaxLength } from 'class-validator';
import { IsCalendarDay } from '../../bench/dto/is-calendar-day';

export class AcceptBookingDto {
  @ApiProperty({ description: 'Who builds it.' })
  @IsUUID('all', { message: 'builderId must be a builder id (a UUID)' })
  builderId: string;

  @ApiProperty({ example: '2026-12-14', description: 'The day the build starts on the bench.' })
  @IsCalendarDay()
  benchDate: string;

  @ApiPropertyOptional({ description: 'Owner only: why a builder below the rig’s minimum level may take it.' })
  @IsOptional()
  @IsString()
  @IsNotEmpty({ message: 'levelOverrideReason must not be empty when given' })
  @MaxLength(500)
  levelOverrideReason?: string;
}
