import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsEmail, IsOptional, IsString, Matches, MaxLength, MinLength } from 'class-validator';

export class UpdateSettingsDto {
  @ApiPropertyOptional()
  @IsOptional()
  @IsString()
  @MinLength(2, { message: 'name must be at least 2 characters' })
  @MaxLength(120)
  name?: string;

  @ApiPropertyOptional()
  @IsOptional()
  @IsString()
  @MaxLength(200)
  tagline?: string;

  @ApiPropertyOptional()
  @IsOptional()
  @IsEmail({}, { message: 'contactEmail must be an e-mail address' })
  contactEmail?: string;

  @ApiPropertyOptional({ example: 'US', description: 'ISO 3166-1 alpha-2; decides the public holidays the bench skips.' })
  @IsOptional()
  @Matches(/^[A-Za-z]{2}$/, { message: 'countryCode must be a two-letter ISO 3166-1 country code like US' })
  countryCode?: string;

  @ApiPropertyOptional({ example: 'America/Chicago', description: 'An IANA time zone name.' })
  @IsOptional()
  @IsString()
  @MaxLength(64)
  timezone?: string;
}
