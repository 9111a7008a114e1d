import { responseSchemas } from '@loomwright/shared/dist/response-schemas';
import { Body, Controller, Get, Param, Post, UploadedFiles, UseFilters, UseInterceptors } from '@nestjs/common';
import { FilesInterceptor } from '@nestjs/platform-express';
import { ApiBody, ApiConsumes, ApiCreatedResponse, ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import {
  MESSAGE_MAX_PHOTOS,
  postMessageSchema,
  type AuthUser,
  type BuildMessageView,
  type MessageThreadView,
  type PostMessageInput,
  type UnreadMessagesView,
} from '@loomwright/shared';
import { CurrentUser } from '../auth/current-user.decorator';
import { bookingIdPipe } from '../bookings/booking-id.pipe';
import { MAX_PHOTO_BYTES, type UploadedPhoto } from '../bookings/booking-photos.service';
import { ApiZodResponse, openApiSchema } from '../common/zod-openapi';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
import { MessagePhotosFilter } from './message-photos.filter';
import { MessagesService } from './messages.service';
import { ApiErrorCodes } from '../common/api-document';

@ApiTags('messages')
@Controller()
export class MessagesController {
  constructor(private readonly messages: MessagesService) {}

  @ApiOperation({ summary: 'A build’s messages between player and shop' })
  @Get('bookings/:id/messages')
  @ApiOkResponse({
    description: "The build's conversation, oldest first; reading it marks it read for the reader's side (the player, or the shop).",
  })
  @ApiZodResponse(responseSchemas.messageThreadViewSchema)
  thread(@CurrentUser() user: AuthUser, @Param('id', bookingIdPipe) id: string): Promise<MessageThreadView> {
    return this.messages.thread(user, id);
  }

  @ApiOperation({ summary: 'Send a message on a build' })
  @ApiErrorCodes('bad_request', 'photo_too_large')
  @Post('bookings/:id/messages')
  @UseFilters(MessagePhotosFilter)
  @UseInterceptors(FilesInterceptor('photos', MESSAGE_MAX_PHOTOS, { limits: { fileSize: MAX_PHOTO_BYTES, files: MESSAGE_MAX_PHOTOS } }))
  @ApiConsumes('multipart/form-data')
  @ApiBody({
    schema: {
      type: 'object',
      properties: {
        ...openApiSchema(postMessageSchema).properties,
        photos: { type: 'array', items: { type: 'string', format: 'binary' }, maxItems: MESSAGE_MAX_PHOTOS },
      },
    },
  })
  @ApiZodResponse(responseSchemas.buildMessageViewSchema)
  @ApiCreatedResponse({
    description:
      'The message as written, with its photos (JPEG, PNG or WebP, up to 8 MB each, 4 per message). The other side hears of it by e-mail within five minutes.',
  })
  post(
    @CurrentUser() user: AuthUser,
    @Param('id', bookingIdPipe) id: string,
    @UploadedFiles() files: UploadedPhoto[] | undefined,
    @Body(new ZodValidationPipe(postMessageSchema)) dto: PostMessageInput,
  ): Promise<BuildMessageView> {
    return this.messages.post(user, id, dto, files ?? []);
  }

  @ApiOperation({ summary: 'Unread messages per build' })
  @Get('messages/unread')
  @ApiOkResponse({
    description:
      "Unread messages from the other side, per build: a player's own builds, a builder's assigned builds, the owner's whole shop.",
  })
  @ApiZodResponse(responseSchemas.unreadMessagesViewSchema)
  unread(@CurrentUser() user: AuthUser): Promise<UnreadMessagesView> {
    return this.messages.unread(user);
  }
}
