import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { ArrayMaxSize, ArrayMinSize, IsArray, IsIn, IsOptional, IsString, MaxLength, MinLength, ValidateNested } from 'class-validator';

export class IntakeItemDto {
  @ApiProperty({ example: 'Analog delay' })
  @IsString({ message: 'item must be text' })
  @MinLength(1, { message: 'item must name the pedal or part' })
  @MaxLength(200)
  item: string;

  @ApiProperty({ enum: ['working', 'faulty'] })
  @IsIn(['working', 'faulty'], { message: 'condition must be working or faulty' })
  condition: 'working' | 'faulty';

  @ApiPropertyOptional()
  @IsOptional()
  @IsString()
  @MaxLength(1000)
  note?: string;
}

export class RecordIntakeDto {
  @ApiProperty({ type: [IntakeItemDto] })
  @IsArray({ message: 'items must be a list' })
  @ArrayMinSize(1, { message: 'items must list at least one pedal or part' })
  @ArrayMaxSize(200)
  @ValidateNested({ each: true })
  @Type(() => IntakeItemDto)
  items: IntakeItemDto[];
}
