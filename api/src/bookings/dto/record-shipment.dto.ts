import { ApiProperty } from '@nestjs/swagger';
import { IsNotEmpty, IsString, MaxLength } from 'class-validator';

export class RecordShipmentDto {
  @ApiProperty({ example: 'Parcel post', description: 'Who carries the parcel to the shop.' })
  @IsString({ message: 'carrier must be text' })
  @IsNotEmpty({ message: 'carrier must not be empty' })
  @MaxLength(100, { message: 'carrier must be at most 100 characters' })
  carrier!: string;

  @ApiProperty({ example: 'PX-4417-0093', description: "The carrier's tracking number." })
  @IsString({ message: 'tracking must be text' })
  @IsNotEmpty({ message: 'tracking must not be empty' })
  @MaxLength(100, { message: 'tracking must be at most 100 characters' })
  tracking!: string;
}
