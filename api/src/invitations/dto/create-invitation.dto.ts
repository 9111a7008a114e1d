import { authMessages, builderLevels, type BuilderLevel } from '@loomwright/shared';
import { ApiProperty } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { IsIn, IsString, Matches, MaxLength, MinLength } from 'class-validator';
import { IsAccountEmail } from '../../auth/dto/account-email';

export class CreateInvitationDto {
  @ApiProperty({ example: 'new.builder@shop.example' })
  @IsAccountEmail()
  email: string;

  @ApiProperty({ example: 'Marit Solberg-Ames' })
  @Transform(({ value }) => (typeof value === 'string' ? value.trim() : value))
  @IsString({ message: authMessages.nameEmpty })
  @MinLength(1, { message: authMessages.nameEmpty })
  @MaxLength(120, { message: authMessages.nameLong })
  name: string;

  @ApiProperty({ enum: builderLevels })
  @IsIn(builderLevels, { message: authMessages.level })
  level: BuilderLevel;

  @ApiProperty({ example: '85.00', description: 'Hourly labor rate as a decimal string.' })
  @Transform(({ value }) => (typeof value === 'number' ? String(value) : typeof value === 'string' ? value.trim() : value))
  @IsString({ message: authMessages.hourlyRate })
  @Matches(/^\d{1,6}(\.\d{1,2})?$/, { message: authMessages.hourlyRate })
  @Matches(/[1-9]/, { message: authMessages.hourlyRate })
  hourlyRate: string;
}
