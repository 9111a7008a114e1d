import { ApiProperty } from '@nestjs/swagger';
import { builderLevels, type BuilderLevel } from '@loomwright/shared';
import { IsIn, Matches } from 'class-validator';

export class LeadTimeDto {
  @ApiProperty({ description: 'Bench hours of the build, as the estimate gives them (a decimal, e.g. "13.00").', example: '13.00' })
  @Matches(/^(?!0+(\.0+)?$)\d{1,3}(\.\d{1,2})?$/, { message: 'hours must be the estimate’s labor hours, a decimal above 0 and below 1000, e.g. 13.00' })
  hours: string;

  @ApiProperty({ enum: builderLevels, description: 'The builder level the estimate is priced at (the higher of the chosen and the minimum).' })
  @IsIn(builderLevels, { message: `level must be one of ${builderLevels.join(', ')}` })
  level: BuilderLevel;
}
