import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsBoolean, IsIn, IsObject, IsOptional, Matches } from 'class-validator';
import { builderLevels, type BuilderLevel, type WeeklyHours } from '@loomwright/shared';

export class UpdateTeamMemberDto {
  @ApiPropertyOptional({ enum: builderLevels })
  @IsOptional()
  @IsIn(builderLevels as unknown as string[], { message: `level must be one of: ${builderLevels.join(', ')}` })
  level?: BuilderLevel;

  @ApiPropertyOptional({ example: '95.00', description: 'Hourly rate in the shop currency, as a decimal string.' })
  @IsOptional()
  @Matches(/^(?!0+(\.0+)?$)\d{1,6}(\.\d{1,2})?$/, { message: 'hourlyRate must be a positive amount like 95.00' })
  hourlyRate?: string;

  @ApiPropertyOptional({ example: { '1': 7, '2': 7, '3': 7, '4': 7, '5': 6 }, description: 'Bench hours per ISO weekday, 1 = Monday … 7 = Sunday.' })
  @IsOptional()
  @IsObject({ message: 'weeklyHours must be an object of ISO weekday → hours' })
  weeklyHours?: WeeklyHours;

  @ApiPropertyOptional()
  @IsOptional()
  @IsBoolean({ message: 'active must be true or false' })
  active?: boolean;
}
