import { ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsIn, IsInt, IsOptional, IsString, Max, MaxLength, Min } from 'class-validator';

export const customerSorts = ['name', 'email', 'createdAt', 'buildCount', 'lastBookingAt'] as const;
export type CustomerSort = (typeof customerSorts)[number];

export class ListCustomersDto {
  @ApiPropertyOptional({ default: 1 })
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'page must be a whole number' })
  @Min(1, { message: 'page must be 1 or more' })
  page: number = 1;

  @ApiPropertyOptional({ default: 25 })
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'pageSize must be a whole number' })
  @Min(1, { message: 'pageSize must be at least 1' })
  @Max(100, { message: 'pageSize must be at most 100' })
  pageSize: number = 25;

  @ApiPropertyOptional({ enum: customerSorts, default: 'name' })
  @IsOptional()
  @IsIn(customerSorts as unknown as string[], { message: `sort must be one of: ${customerSorts.join(', ')}` })
  sort: CustomerSort = 'name';

  @ApiPropertyOptional({ enum: ['asc', 'desc'], default: 'asc' })
  @IsOptional()
  @IsIn(['asc', 'desc'], { message: 'order must be asc or desc' })
  order: 'asc' | 'desc' = 'asc';

  @ApiPropertyOptional({ description: 'Part of a name or e-mail address.' })
  @IsOptional()
  @IsString()
  @MaxLength(100)
  search?: string;
}
