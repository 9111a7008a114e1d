import { ArgumentsHost, Catch, ExceptionFilter, PayloadTooLargeException } from '@nestjs/common';
import type { Response } from 'express';
import { photoTooLargeMessage } from './booking-photos.service';

/** Multer stops reading at the size limit and says only "File too large"; say what to do instead. */
@Catch(PayloadTooLargeException)
export class PhotoTooLargeFilter implements ExceptionFilter {
  catch(_exception: PayloadTooLargeException, host: ArgumentsHost) {
    host
      .switchToHttp()
      .getResponse<Response>()
      .status(413)
      .json({ statusCode: 413, error: 'Payload Too Large', message: photoTooLargeMessage });
  }
}
