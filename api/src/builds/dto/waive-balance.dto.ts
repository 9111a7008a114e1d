import { ApiProperty } from '@nestjs/swagger';
import { IsString, MaxLength, MinLength } from 'class-validator';

export class WaiveBalanceDto {
  @ApiProperty({ example: 'Paid in cash at collection.' })
  @IsString({ message: 'reason must be text' })
  @MinLength(3, { message: 'reason must say why the balance is waived' })
  @MaxLength(1000)
  reason: string;
}
