import { ApiProperty } from '@nestjs/swagger';
import { IsLinkToken, IsNewPassword } from './new-password';

export class ConfirmPasswordResetDto {
  @ApiProperty({ description: 'The token from the e-mailed link.' })
  @IsLinkToken()
  token: string;

  @ApiProperty({ minLength: 10 })
  @IsNewPassword()
  password: string;
}
