import { responseSchemas } from '@loomwright/shared/dist/response-schemas';
import { Body, Controller, Get, Param, Post, Query, Res, UploadedFile, UseFilters, UseInterceptors } from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import { ApiBody, ApiConsumes, ApiCreatedResponse, ApiOkResponse, ApiOperation, ApiProduces, ApiTags } from '@nestjs/swagger';
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
import { ApiZodBody, ApiZodQuery, ApiZodResponse, openApiSchema } from '../common/zod-openapi';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
import { bookingIdPipe, photoIdPipe } from './booking-id.pipe';
import { BookingPhotosService, MAX_PHOTO_BYTES, type UploadedPhoto } from './booking-photos.service';
import { BookingsService } from './bookings.service';
import { PhotoTooLargeFilter } from './photo-too-large.filter';
import { ApiErrorCodes } from '../common/api-document';

@ApiTags('bookings')
@Controller('bookings')
export class BookingsController {
  constructor(
    private readonly bookings: BookingsService,
    private readonly photos: BookingPhotosService,
  ) {}

  @ApiOperation({ summary: 'Request a build from a configuration' })
  @ApiZodResponse(responseSchemas.bookingDetailSchema)
  @Post()
  @Roles('customer')
  @ApiCreatedResponse({ description: 'The booking in state requested, with its quote snapshot.' })
  @ApiZodBody(createBookingSchema)
  create(@CurrentUser() user: AuthUser, @Body(new ZodValidationPipe(createBookingSchema)) dto: CreateBookingInput) {
    return this.bookings.create(user, dto);
  }

  @ApiOperation({ summary: 'List bookings, a page at a time' })
  @ApiZodResponse(responseSchemas.bookingPageSchema)
  @Get()
  @ApiOkResponse({ description: 'A page of bookings: a player sees their own, staff see all.' })
  @ApiZodQuery(listBookingsQuerySchema)
  list(@CurrentUser() user: AuthUser, @Query(new ZodValidationPipe(listBookingsQuerySchema)) query: ListBookingsQuery) {
    return this.bookings.list(user, query);
  }

  @ApiOperation({ summary: 'One booking with quote, payments, photos and history' })
  @ApiZodResponse(responseSchemas.bookingDetailSchema)
  @Get(':id')
  @ApiOkResponse({ description: 'One booking with its quote, payments, photos and timeline.' })
  detail(@CurrentUser() user: AuthUser, @Param('id', bookingIdPipe) id: string) {
    return this.bookings.getDetailFor(user, id);
  }

  @ApiOperation({ summary: 'Record the parcel carrying the pedals' })
  @ApiZodResponse(responseSchemas.bookingDetailSchema)
  @ApiErrorCodes('conflict')
  @Post(':id/shipment')
  @Roles('customer')
  @ApiOkResponse({ description: 'Records the carrier and tracking of the parcel carrying the pedals in.' })
  @ApiZodBody(shipmentSchema)
  shipment(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingIdPipe) id: string,
    @Body(new ZodValidationPipe(shipmentSchema)) dto: ShipmentInput,
  ) {
    return this.bookings.recordShipment(user, id, dto);
  }

  @ApiOperation({ summary: 'Upload a photo to a booking' })
  @ApiZodResponse(responseSchemas.photoViewSchema)
  @ApiErrorCodes('bad_request', 'conflict', 'photo_too_large')
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

  @ApiOperation({ summary: 'A booking photo' })
  @Get(':id/photos/:photoId')
  @ApiProduces('image/jpeg', 'image/png', 'image/webp')
  @ApiOkResponse({ description: "The photo, re-encoded on upload without its camera metadata (the booking's player and staff only)." })
  async photo(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingIdPipe) id: string,
    @Param('photoId', photoIdPipe) photoId: string,
    @Res() res: Response,
  ) {
    sendImage(res, await this.photos.read(user, id, photoId, 'full'));
  }

  @ApiOperation({ summary: 'A booking photo’s thumbnail' })
  @Get(':id/photos/:photoId/thumbnail')
  @ApiProduces('image/webp')
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
