import { ApiPropertyOptional } from '@nestjs/swagger';
import { bookingStates, type BookingState, type DepositStatus } from '@loomwright/shared';
import { Type } from 'class-transformer';
import { IsIn, IsInt, IsOptional, IsString, Max, MaxLength, Min } from 'class-validator';

export const bookingSortColumns = ['created_at', 'updated_at', 'reference', 'state', 'bench_date'] as const;
const depositStatuses: DepositStatus[] = ['unpaid', 'pending', 'paid', 'refunded'];

export class ListBookingsDto {
  @ApiPropertyOptional({ minimum: 1, default: 1 })
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'page must be a whole number' })
  @Min(1, { message: 'page must be 1 or more' })
  page?: number;

  @ApiPropertyOptional({ minimum: 1, maximum: 100, default: 25 })
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'pageSize must be a whole number' })
  @Min(1, { message: 'pageSize must be 1 or more' })
  @Max(100, { message: 'pageSize must be at most 100' })
  pageSize?: number;

  @ApiPropertyOptional({ enum: bookingSortColumns, default: 'created_at' })
  @IsOptional()
  @IsIn(bookingSortColumns, { message: `sort must be one of ${bookingSortColumns.join(', ')}` })
  sort?: (typeof bookingSortColumns)[number];

  @ApiPropertyOptional({ enum: ['asc', 'desc'], default: 'desc' })
  @IsOptional()
  @IsIn(['asc', 'desc'], { message: 'order must be asc or desc' })
  order?: 'asc' | 'desc';

  @ApiPropertyOptional({ enum: bookingStates })
  @IsOptional()
  @IsIn(bookingStates, { message: `state must be one of ${bookingStates.join(', ')}` })
  state?: BookingState;

  @ApiPropertyOptional({ enum: depositStatuses, description: 'Deposit status filter.' })
  @IsOptional()
  @IsIn(depositStatuses, { message: `deposit must be one of ${depositStatuses.join(', ')}` })
  deposit?: DepositStatus;

  @ApiPropertyOptional({ description: 'Search the reference, customer name or e-mail.' })
  @IsOptional()
  @IsString({ message: 'q must be text' })
  @MaxLength(200, { message: 'q must be at most 200 characters' })
  q?: string;
}
