import { ApiProperty } from '@nestjs/swagger';
import { IsString, Matches, MaxLength, MinLength } from 'class-validator';

export class ProposeExtraDto {
  @ApiProperty({ example: 'Longer road case' })
  @IsString({ message: 'description must be text' })
  @MinLength(2, { message: 'description must say what the extra is' })
  @MaxLength(300)
  description: string;

  @ApiProperty({ example: '45.00', description: 'Decimal string in the shop currency.' })
  @Matches(/^(?!0+(\.0+)?$)\d{1,8}(\.\d{1,2})?$/, { message: 'amount must be a positive amount like 45.00' })
  amount: string;

  @ApiProperty({ example: 'The pedals need a deeper case than the one quoted.' })
  @IsString({ message: 'reason must be text' })
  @MinLength(3, { message: 'reason must say why the extra is needed' })
  @MaxLength(1000)
  reason: string;
}
