import { Body, Controller, Delete, Get, HttpCode, Param, Patch, Post } from '@nestjs/common';
import { uuidParam } from '../common/uuid-param.pipe';
import { ApiCookieAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import {
  createClosureSchema,
  updateSettingsSchema,
  type AddClosureResponse,
  type CreateClosureInput,
  type ShopClosureView,
  type ShopSettingsView,
  type UpdateSettingsInput, requestWords } from '@loomwright/shared';
import { Roles } from '../auth/roles.decorator';
import { ApiZodBody } from '../common/zod-openapi';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
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
  @ApiZodBody(updateSettingsSchema)
  update(@Body(new ZodValidationPipe(updateSettingsSchema)) dto: UpdateSettingsInput): Promise<ShopSettingsView> {
    return this.settings.update(dto);
  }

  @Get('closures')
  @Roles('owner')
  closures(): Promise<ShopClosureView[]> {
    return this.settings.closures();
  }

  @Post('closures')
  @Roles('owner')
  @ApiZodBody(createClosureSchema)
  addClosure(@Body(new ZodValidationPipe(createClosureSchema)) dto: CreateClosureInput): Promise<AddClosureResponse> {
    return this.settings.addClosure(dto);
  }

  @Delete('closures/:id')
  @HttpCode(204)
  @Roles('owner')
  deleteClosure(@Param('id', uuidParam(requestWords.notAnId('a closure'))) id: string) {
    return this.settings.deleteClosure(id);
  }
}
