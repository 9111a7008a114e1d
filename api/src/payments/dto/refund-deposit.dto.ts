import { ApiProperty } from '@nestjs/swagger';
import { IsNotEmpty, IsString, MaxLength } from 'class-validator';

export class RefundDepositDto {
  @ApiProperty({ example: 'The player moved abroad before the bench date.', description: 'Why the deposit goes back (on the timeline and in the e-mail).' })
  @IsString({ message: 'reason must be text' })
  @IsNotEmpty({ message: 'reason must say why the deposit is refunded' })
  @MaxLength(1000, { message: 'reason must be at most 1000 characters' })
  reason!: string;
}
