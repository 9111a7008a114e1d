import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsOptional, IsUUID } from 'class-validator';

export class SuggestBenchDto {
  @ApiProperty({ description: 'The booking to find bench time for.' })
  @IsUUID('all', { message: 'bookingId must be a booking id (a UUID)' })
  bookingId: string;

  @ApiPropertyOptional({ description: 'Only this builder (the owner may pick one below the rig’s level).' })
  @IsOptional()
  @IsUUID('all', { message: 'builderId must be a builder id (a UUID)' })
  builderId?: string;
}
