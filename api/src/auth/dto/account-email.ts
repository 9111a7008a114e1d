import { authMessages } from '@loomwright/shared';
import { applyDecorators } from '@nestjs/common';
import { Transform } from 'class-transformer';
import { IsEmail, IsString, MaxLength } from 'class-validator';

/** An e-mail field as every account form takes it: trimmed, lower-cased, at most 254 characters (RFC 5321). */
export const IsAccountEmail = () =>
  applyDecorators(
    Transform(({ value }) => (typeof value === 'string' ? value.trim().toLowerCase() : value)),
    IsString({ message: authMessages.email }),
    IsEmail({}, { message: authMessages.email }),
    MaxLength(254, { message: authMessages.email }),
  );

