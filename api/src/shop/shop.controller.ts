import { Controller, Get } from '@nestjs/common';
import { ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { Public } from '../auth/public.decorator';
import { ShopService } from './shop.service';

@ApiTags('shop')
@Controller('shop')
export class ShopController {
  constructor(private readonly shop: ShopService) {}

  @Public()
  @Get()
  @ApiOkResponse({ description: "The shop's public profile: name, currency, country, contact." })
  profile() {
    return this.shop.profile();
  }
}
