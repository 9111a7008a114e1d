import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsIn, IsOptional, IsString, MaxLength } from 'class-validator';

/** The text fields that may travel beside the multipart `file`. */
export class UploadPhotoDto {
  @ApiPropertyOptional({ description: 'A short caption, e.g. "power supply, underside".' })
  @IsOptional()
  @IsString({ message: 'caption must be text' })
  @MaxLength(200, { message: 'caption must be at most 200 characters' })
  caption?: string;

  @ApiPropertyOptional({ enum: ['intake', 'build'], description: 'Staff only: an intake or a build photo.' })
  @IsOptional()
  @IsIn(['intake', 'build'], { message: 'kind must be intake or build' })
  kind?: 'intake' | 'build';
}
