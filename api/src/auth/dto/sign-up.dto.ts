import { authMessages } from '@loomwright/shared';
import { ApiProperty } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { IsString, MaxLength, MinLength } from 'class-validator';
import { IsAccountEmail } from './account-email';
import { IsNewPassword } from './new-password';

export class SignUpDto {
  @ApiProperty({ example: 'new.player@mail.example' })
  @IsAccountEmail()
  email: string;

  @ApiProperty({ minLength: 10, description: 'At least 10 characters.' })
  @IsNewPassword()
  password: string;

  @ApiProperty({ example: 'Juniper Marsh' })
  @Transform(({ value }) => (typeof value === 'string' ? value.trim() : value))
  @IsString({ message: authMessages.nameEmpty })
  @MinLength(1, { message: authMessages.nameEmpty })
  @MaxLength(120, { message: authMessages.nameLong })
  name: string;
}
