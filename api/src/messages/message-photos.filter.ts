import { ArgumentsHost, BadRequestException, Catch, ExceptionFilter, HttpException, PayloadTooLargeException } from '@nestjs/common';
import { errorResponse, MESSAGE_MAX_PHOTOS, messageWords } from '@loomwright/shared';
import type { Request, Response } from 'express';
import { errorBody } from '../common/error-body';
import { photoTooLargeMessage } from '../bookings/booking-photos.service';

/**
 * Multer's own refusals say only "File too large", "Too many files" or "Unexpected field"; a
 * message's sender reads what to do instead. Every other error passes through unchanged.
 */
@Catch(PayloadTooLargeException, BadRequestException)
export class MessagePhotosFilter implements ExceptionFilter {
  catch(exception: HttpException, host: ArgumentsHost) {
    const http = host.switchToHttp();
    const res = http.getResponse<Response>();
    const req = http.getRequest<Request>();
    if (exception instanceof PayloadTooLargeException) {
      res.status(413).json(errorBody(413, errorResponse('photo_too_large', photoTooLargeMessage), req));
      return;
    }
    const said = exception.getResponse();
    const text = typeof said === 'string' ? said : (said as { message?: unknown }).message;
    if (text === 'Too many files' || text === 'Unexpected field') {
      res
        .status(400)
        .json(
          errorBody(400, errorResponse('bad_request', `${messageWords.tooManyPhotos(MESSAGE_MAX_PHOTOS)}, in the field "photos"`), req),
        );
      return;
    }
    res.status(exception.getStatus()).json(errorBody(exception.getStatus(), said, req));
  }
}
