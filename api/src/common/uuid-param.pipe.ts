import { BadRequestException, ParseUUIDPipe } from '@nestjs/common';
import { errorResponse } from '@loomwright/shared';

/** An id in the address, refused with 400 `invalid_id` and the given words unless it is a UUID. */
export const uuidParam = (words: string) =>
  new ParseUUIDPipe({ exceptionFactory: () => new BadRequestException(errorResponse('invalid_id', words)) });
