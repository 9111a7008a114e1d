import { requestWords } from '@loomwright/shared';
import { uuidParam } from '../common/uuid-param.pipe';

/** Route ids are UUIDs; anything else is the caller's mistake, answered in words. */
export const bookingIdPipe = uuidParam(requestWords.notAnId('a booking'));
export const photoIdPipe = uuidParam(requestWords.notAnId('a photo'));
