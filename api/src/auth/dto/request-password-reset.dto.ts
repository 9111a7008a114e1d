import { ApiProperty } from '@nestjs/swagger';
import { IsAccountEmail } from './account-email';

export class RequestPasswordResetDto {
  @ApiProperty({ example: 'player@mail.example' })
  @IsAccountEmail()
  email: string;
}
