import { responseSchemas } from '@loomwright/shared/dist/response-schemas';
import { Body, Controller, Get, Post } from '@nestjs/common';
import { ApiCreatedResponse, ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import { publishPriceBookSchema, type AuthUser, type PriceBook } from '@loomwright/shared';
import { CurrentUser } from '../auth/current-user.decorator';
import { Public } from '../auth/public.decorator';
import { Roles } from '../auth/roles.decorator';
import { ApiZodBody, ApiZodResponse } from '../common/zod-openapi';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
import { PriceBookService } from './price-book.service';
import { ApiErrorCodes } from '../common/api-document';

@ApiTags('price book')
@Controller()
export class PriceBookController {
  constructor(private readonly priceBook: PriceBookService) {}

  @Public()
  @ApiOperation({ summary: 'The current price book for the configurator' })
  @ApiZodResponse(responseSchemas.catalogSchema)
  @Get('catalog')
  @ApiOkResponse({ description: "The current price book's surfaces, cases, functions, levels and deposit policy." })
  catalog() {
    return this.priceBook.catalog();
  }

  @Roles('builder', 'owner')
  @ApiOperation({ summary: 'The price book with every published version' })
  @ApiZodResponse(responseSchemas.priceBookOverviewSchema)
  @Get('price-book')
  @ApiOkResponse({ description: 'The current book in full and every published version.' })
  overview() {
    return this.priceBook.overview();
  }

  @Roles('owner')
  @ApiOperation({ summary: 'Publish a new price book version' })
  @ApiZodResponse(responseSchemas.priceBookVersionSummarySchema)
  @ApiErrorCodes('conflict')
  @Post('price-book')
  @ApiZodBody(publishPriceBookSchema)
  @ApiCreatedResponse({ description: 'The new version; quotes priced earlier keep theirs.' })
  publish(@Body(new ZodValidationPipe(publishPriceBookSchema)) body: { book: PriceBook; notes: string }, @CurrentUser() user: AuthUser) {
    return this.priceBook.publish(body.book, body.notes, user.id);
  }
}
