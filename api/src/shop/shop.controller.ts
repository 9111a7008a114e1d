import { ApiZodResponse } from '../common/zod-openapi';
import { responseSchemas } from '@loomwright/shared/dist/response-schemas';
import { Controller, Get } from '@nestjs/common';
import { ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import { Public } from '../auth/public.decorator';
import { ShopService } from './shop.service';

@ApiTags('shop')
@Controller('shop')
export class ShopController {
  constructor(private readonly shop: ShopService) {}

  @Public()
  @ApiOperation({ summary: 'The shop’s public profile' })
  @ApiZodResponse(responseSchemas.shopProfileSchema)
  @Get()
  @ApiOkResponse({ description: "The shop's public profile: name, currency, country, contact." })
  profile() {
    return this.shop.profile();
  }
}
