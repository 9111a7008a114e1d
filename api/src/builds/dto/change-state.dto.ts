import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsIn, IsOptional, IsString, MaxLength } from 'class-validator';
import { benchStates, type BenchState } from '@loomwright/shared';

export class ChangeStateDto {
  @ApiProperty({ enum: benchStates })
  @IsIn(benchStates as unknown as string[], { message: `to must be one of: ${benchStates.join(', ')}` })
  to: BenchState;

  @ApiPropertyOptional({ description: 'Shown in the build’s history.' })
  @IsOptional()
  @IsString()
  @MaxLength(1000)
  note?: string;
}
