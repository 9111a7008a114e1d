import { ApiProperty } from '@nestjs/swagger';
import { IsString, MaxLength, MinLength } from 'class-validator';

export class DeclineBookingDto {
  @ApiProperty({ example: 'We cannot source a case that fits this surface.', description: 'Told to the player in words.' })
  @IsString({ message: 'reason must be text' })
  @MinLength(3, { message: 'reason must say why, in at least a few words' })
  @MaxLength(1000)
  reason: string;
}
