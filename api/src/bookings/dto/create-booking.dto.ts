import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsObject, IsOptional, IsString, MaxLength } from 'class-validator';

export class CreateBookingDto {
  @ApiProperty({ description: 'The rig configuration, as POST /api/estimates takes it; re-priced on the server.' })
  @IsObject({ message: 'configuration must be an object describing the rig (surface, case, pedals, routing, level)' })
  configuration!: Record<string, unknown>;

  @ApiPropertyOptional({ description: 'Anything the shop should know about the rig.', maxLength: 4000 })
  @IsOptional()
  @IsString({ message: 'notes must be text' })
  @MaxLength(4000, { message: 'notes must be at most 4000 characters' })
  notes?: string;
}
