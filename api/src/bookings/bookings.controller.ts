import {
  Body,
  Controller,
  Get,
  Param,
  Post,
  Query,
  Res,
  UploadedFile,
  UseFilters,
  UseInterceptors,
} from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import { ApiBody, ApiConsumes, ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import {
  createBookingSchema,
  listBookingsQuerySchema,
  photoFieldsSchema,
  shipmentSchema,
  type AuthUser,
  type CreateBookingInput,
  type ListBookingsQuery,
  type PhotoFieldsInput,
  type ShipmentInput,
} from '@loomwright/shared';
import type { Response } from 'express';
import { CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { ApiZodBody, ApiZodQuery, openApiSchema } from '../common/zod-openapi';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
import { bookingIdPipe, photoIdPipe } from './booking-id.pipe';
import { BookingPhotosService, MAX_PHOTO_BYTES, type UploadedPhoto } from './booking-photos.service';
import { BookingsService } from './bookings.service';
import { PhotoTooLargeFilter } from './photo-too-large.filter';

@ApiTags('bookings')
@Controller('bookings')
export class BookingsController {
  constructor(
    private readonly bookings: BookingsService,
    private readonly photos: BookingPhotosService,
  ) {}

  @Post()
  @Roles('customer')
  @ApiCreatedResponse({ description: 'The booking in state requested, with its quote snapshot.' })
  @ApiZodBody(createBookingSchema)
  create(@CurrentUser() user: AuthUser, @Body(new ZodValidationPipe(createBookingSchema)) dto: CreateBookingInput) {
    return this.bookings.create(user, dto);
  }

  @Get()
  @ApiOkResponse({ description: 'A page of bookings: a player sees their own, staff see all.' })
  @ApiZodQuery(listBookingsQuerySchema)
  list(@CurrentUser() user: AuthUser, @Query(new ZodValidationPipe(listBookingsQuerySchema)) query: ListBookingsQuery) {
    return this.bookings.list(user, query);
  }

  @Get(':id')
  @ApiOkResponse({ description: 'One booking with its quote, payments, photos and timeline.' })
  detail(@CurrentUser() user: AuthUser, @Param('id', bookingIdPipe) id: string) {
    return this.bookings.getDetailFor(user, id);
  }

  @Post(':id/shipment')
  @Roles('customer')
  @ApiOkResponse({ description: 'Records the carrier and tracking of the parcel carrying the pedals in.' })
  @ApiZodBody(shipmentSchema)
  shipment(@CurrentUser() user: AuthUser, @Param('id', bookingIdPipe) id: string, @Body(new ZodValidationPipe(shipmentSchema)) dto: ShipmentInput) {
    return this.bookings.recordShipment(user, id, dto);
  }

  @Post(':id/photos')
  @UseFilters(PhotoTooLargeFilter)
  @UseInterceptors(FileInterceptor('file', { limits: { fileSize: MAX_PHOTO_BYTES, files: 1 } }))
  @ApiConsumes('multipart/form-data')
  @ApiBody({
    schema: {
      type: 'object',
      required: ['file'],
      properties: { file: { type: 'string', format: 'binary' }, ...openApiSchema(photoFieldsSchema).properties },
    },
  })
  @ApiCreatedResponse({ description: 'The stored photo (JPEG, PNG or WebP, up to 8 MB, 8 per booking).' })
  uploadPhoto(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingIdPipe) id: string,
    @UploadedFile() file: UploadedPhoto | undefined,
    @Body(new ZodValidationPipe(photoFieldsSchema)) dto: PhotoFieldsInput,
  ) {
    return this.photos.upload(user, id, file, dto);
  }

  @Get(':id/photos/:photoId')
  @ApiOkResponse({ description: "The photo, re-encoded on upload without its camera metadata (the booking's player and staff only)." })
  async photo(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingIdPipe) id: string,
    @Param('photoId', photoIdPipe) photoId: string,
    @Res() res: Response,
  ) {
    sendImage(res, await this.photos.read(user, id, photoId, 'full'));
  }

  @Get(':id/photos/:photoId/thumbnail')
  @ApiOkResponse({ description: 'A copy of the photo at most 480 px on its long edge, as WebP, for photo lists.' })
  async photoThumbnail(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingIdPipe) id: string,
    @Param('photoId', photoIdPipe) photoId: string,
    @Res() res: Response,
  ) {
    sendImage(res, await this.photos.read(user, id, photoId, 'thumbnail'));
  }
}

function sendImage(res: Response, image: { bytes: Buffer; contentType: string }) {
  res.setHeader('Content-Type', image.contentType);
  res.setHeader('Cache-Control', 'private, max-age=3600');
  res.setHeader('X-Content-Type-Options', 'nosniff');
  res.send(image.bytes);
}
