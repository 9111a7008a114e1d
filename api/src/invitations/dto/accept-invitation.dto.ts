import { ApiProperty } from '@nestjs/swagger';
import { IsLinkToken, IsNewPassword } from '../../auth/dto/new-password';

export class AcceptInvitationDto {
  @ApiProperty({ description: 'The token from the invitation e-mail.' })
  @IsLinkToken()
  token: string;

  @ApiProperty({ minLength: 10 })
  @IsNewPassword()
  password: string;
}
