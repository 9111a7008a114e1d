import { authMessages, PASSWORD_MAX_LENGTH, PASSWORD_MIN_LENGTH } from '@loomwright/shared';
import { applyDecorators } from '@nestjs/common';
import { IsString, Matches, MaxLength, MinLength } from 'class-validator';

/** A password being chosen: the same length rule and words as the apps' forms (shared/auth-schemas). */
export const IsNewPassword = () =>
  applyDecorators(
    IsString({ message: authMessages.passwordShort }),
    MinLength(PASSWORD_MIN_LENGTH, { message: authMessages.passwordShort }),
    MaxLength(PASSWORD_MAX_LENGTH, { message: authMessages.passwordLong }),
  );

/** A token from an e-mailed link: 32 random bytes in base64url. */
export const IsLinkToken = () =>
  applyDecorators(IsString({ message: authMessages.token }), Matches(/^[A-Za-z0-9_-]{43}$/, { message: authMessages.token }));
