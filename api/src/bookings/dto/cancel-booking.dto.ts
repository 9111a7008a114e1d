import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsOptional, IsString, MaxLength } from 'class-validator';

export class CancelBookingDto {
  @ApiPropertyOptional({ description: 'Why the player cancels (shown to the shop).' })
  @IsOptional()
  @IsString({ message: 'reason must be text' })
  @MaxLength(1000, { message: 'reason must be at most 1000 characters' })
  reason?: string;
}
