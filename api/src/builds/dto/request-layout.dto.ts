import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsOptional, IsString, MaxLength } from 'class-validator';

export class LayoutNoteDto {
  @ApiPropertyOptional({ description: 'A word for the player about the layout.' })
  @IsOptional()
  @IsString()
  @MaxLength(1000)
  note?: string;
}
