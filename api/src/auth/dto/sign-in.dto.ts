import { authMessages, PASSWORD_MAX_LENGTH } from '@loomwright/shared';
import { ApiProperty } from '@nestjs/swagger';
import { IsString, MaxLength, MinLength } from 'class-validator';
import { IsAccountEmail } from './account-email';

export class SignInDto {
  @ApiProperty({ example: 'player@mail.example' })
  @IsAccountEmail()
  email: string;

  @ApiProperty()
  @IsString({ message: authMessages.passwordEmpty })
  @MinLength(1, { message: authMessages.passwordEmpty })
  @MaxLength(PASSWORD_MAX_LENGTH, { message: authMessages.passwordLong })
  password: string;
}
