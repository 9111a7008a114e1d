import { ArgumentsHost, Catch, ExceptionFilter, PayloadTooLargeException } from '@nestjs/common';
import { errorResponse } from '@loomwright/shared';
import type { Request, Response } from 'express';
import { errorBody } from '../common/error-body';
import { photoTooLargeMessage } from './booking-photos.service';

/** Multer stops reading at the size limit and says only "File too large"; say what to do instead. */
@Catch(PayloadTooLargeException)
export class PhotoTooLargeFilter implements ExceptionFilter {
  catch(_exception: PayloadTooLargeException, host: ArgumentsHost) {
    const http = host.switchToHttp();
    http
      .getResponse<Response>()
      .status(413)
      .json(errorBody(413, errorResponse('photo_too_large', photoTooLargeMessage), http.getRequest<Request>()));
  }
}
