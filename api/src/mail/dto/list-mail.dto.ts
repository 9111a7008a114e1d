import { ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsIn, IsInt, IsOptional, IsString, Max, MaxLength, Min } from 'class-validator';
import { mailStates, type MailState } from '@loomwright/shared';

export class ListMailDto {
  @ApiPropertyOptional({ minimum: 1, default: 1 })
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'page must be a whole number' })
  @Min(1, { message: 'page must be 1 or more' })
  page: number = 1;

  @ApiPropertyOptional({ minimum: 1, maximum: 100, default: 25 })
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'pageSize must be a whole number' })
  @Min(1, { message: 'pageSize must be between 1 and 100' })
  @Max(100, { message: 'pageSize must be between 1 and 100' })
  pageSize: number = 25;

  @ApiPropertyOptional({ enum: mailStates })
  @IsOptional()
  @IsIn(mailStates, { message: `state must be one of ${mailStates.join(', ')}` })
  state?: MailState;

  @ApiPropertyOptional({ description: 'Part of the recipient address' })
  @IsOptional()
  @IsString({ message: 'q must be text' })
  @MaxLength(200, { message: 'q must be at most 200 characters' })
  q?: string;
}
