import { ApiProperty } from '@nestjs/swagger';
import { IsBoolean } from 'class-validator';

export class DecideExtraDto {
  @ApiProperty()
  @IsBoolean({ message: 'approve must be true or false' })
  approve: boolean;
}
