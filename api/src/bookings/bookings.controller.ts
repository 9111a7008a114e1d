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
import type { AuthUser } from '@loomwright/shared';
import type { Response } from 'express';
import { CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { bookingIdPipe, photoIdPipe } from './booking-id.pipe';
import { BookingPhotosService, MAX_PHOTO_BYTES, type UploadedPhoto } from './booking-photos.service';
import { BookingsService } from './bookings.service';
import { CreateBookingDto } from './dto/create-booking.dto';
import { ListBookingsDto } from './dto/list-bookings.dto';
import { RecordShipmentDto } from './dto/record-shipment.dto';
import { UploadPhotoDto } from './dto/upload-photo.dto';
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
  create(@CurrentUser() user: AuthUser, @Body() dto: CreateBookingDto) {
    return this.bookings.create(user, dto);
  }

  @Get()
  @ApiOkResponse({ description: 'A page of bookings: a player sees their own, staff see all.' })
  list(@CurrentUser() user: AuthUser, @Query() query: ListBookingsDto) {
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
  shipment(@CurrentUser() user: AuthUser, @Param('id', bookingIdPipe) id: string, @Body() dto: RecordShipmentDto) {
    return this.bookings.recordShipment(user, id, dto);
  }

  @Post(':id/photos')
  @UseFilters(PhotoTooLargeFilter)
  @UseInterceptors(FileInterceptor('file', { limits: { fileSize: MAX_PHOTO_BYTES, files: 1 } }))
  @ApiConsumes('multipart/form-data')
  @ApiBody({
    schema: {
      type: 'object',
      properties: { file: { type: 'string', format: 'binary' }, caption: { type: 'string' }, kind: { type: 'string' } },
    },
  })
  @ApiCreatedResponse({ description: 'The stored photo (JPEG, PNG or WebP, up to 8 MB, 8 per booking).' })
  uploadPhoto(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingIdPipe) id: string,
    @UploadedFile() file: UploadedPhoto | undefined,
    @Body() dto: UploadPhotoDto,
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
