import { ApiProperty } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { IsEmail, IsString, MaxLength, MinLength } from 'class-validator';

export class SignUpDto {
  @ApiProperty({ example: 'new.player@mail.example' })
  @Transform(({ value }) => (typeof value === 'string' ? value.trim().toLowerCase() : value))
  @IsEmail({}, { message: 'email must be an e-mail address, like name@example.com' })
  @MaxLength(254)
  email: string;

  @ApiProperty({ minLength: 10, description: 'At least 10 characters.' })
  @IsString()
  @MinLength(10, { message: 'password must be at least 10 characters long' })
  @MaxLength(200)
  password: string;

  @ApiProperty({ example: 'Juniper Marsh' })
  @Transform(({ value }) => (typeof value === 'string' ? value.trim() : value))
  @IsString()
  @MinLength(1, { message: 'name must not be empty' })
  @MaxLength(120)
  name: string;
}
