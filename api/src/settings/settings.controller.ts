import { BadRequestException, Body, Controller, Delete, Get, HttpCode, Param, ParseUUIDPipe, Patch, Post } from '@nestjs/common';
import { ApiCookieAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { AddClosureResponse, ShopClosureView, ShopSettingsView } from '@loomwright/shared';
import { Roles } from '../auth/roles.decorator';
import { CreateClosureDto } from './dto/create-closure.dto';
import { UpdateSettingsDto } from './dto/update-settings.dto';
import { SettingsService } from './settings.service';

@ApiTags('settings')
@ApiCookieAuth('lw_session')
@Controller('settings')
export class SettingsController {
  constructor(private readonly settings: SettingsService) {}

  @Get()
  @Roles('builder', 'owner')
  @ApiOkResponse({ description: 'Shop details, closures and the coming public holidays of its country.' })
  get(): Promise<ShopSettingsView> {
    return this.settings.get();
  }

  @Patch()
  @Roles('owner')
  update(@Body() dto: UpdateSettingsDto): Promise<ShopSettingsView> {
    return this.settings.update(dto);
  }

  @Get('closures')
  @Roles('owner')
  closures(): Promise<ShopClosureView[]> {
    return this.settings.closures();
  }

  @Post('closures')
  @Roles('owner')
  addClosure(@Body() dto: CreateClosureDto): Promise<AddClosureResponse> {
    return this.settings.addClosure(dto);
  }

  @Delete('closures/:id')
  @HttpCode(204)
  @Roles('owner')
  deleteClosure(@Param('id', new ParseUUIDPipe({ exceptionFactory: () => new BadRequestException('The closure id in the address must be a UUID.') })) id: string) {
    return this.settings.deleteClosure(id);
  }
}
