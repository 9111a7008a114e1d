import { z } from 'zod';
import { responseSchemas } from '@loomwright/shared/dist/response-schemas';
import { Body, Controller, Delete, Get, HttpCode, Param, Patch, Post, Put } from '@nestjs/common';
import { uuidParam } from '../common/uuid-param.pipe';
import { ApiCookieAuth, ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import {
  calendarDay,
  createClosureSchema,
  holidayChoiceSchema,
  type AuthUser,
  type HolidayChoiceInput,
  type HolidayChoiceResponse,
  updateSettingsSchema,
  type AddClosureResponse,
  type CreateClosureInput,
  type ShopClosureView,
  type ShopSettingsView,
  type UpdateSettingsInput,
  requestWords,
} from '@loomwright/shared';
import { CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { ApiZodBody, ApiZodResponse } from '../common/zod-openapi';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
import { SettingsService } from './settings.service';
import { ApiErrorCodes } from '../common/api-document';

@ApiTags('settings')
@ApiCookieAuth('lw_session')
@Controller('settings')
export class SettingsController {
  constructor(private readonly settings: SettingsService) {}

  @ApiOperation({ summary: 'The shop’s settings' })
  @ApiZodResponse(responseSchemas.shopSettingsViewSchema)
  @Get()
  @Roles('builder', 'owner')
  @ApiOkResponse({ description: 'Shop details, closures and the coming public holidays of its country.' })
  get(): Promise<ShopSettingsView> {
    return this.settings.get();
  }

  @ApiOperation({ summary: 'Change the shop’s settings' })
  @ApiZodResponse(responseSchemas.shopSettingsViewSchema)
  @Patch()
  @Roles('owner')
  @ApiZodBody(updateSettingsSchema)
  update(@Body(new ZodValidationPipe(updateSettingsSchema)) dto: UpdateSettingsInput): Promise<ShopSettingsView> {
    return this.settings.update(dto);
  }

  /** Whether the shop works on one public holiday of its country (the per-holiday opt-out). */
  @ApiOperation({ summary: 'Choose whether the shop works on a public holiday' })
  @ApiZodResponse(responseSchemas.holidayChoiceResponseSchema)
  @ApiErrorCodes('bad_request')
  @Put('holidays/:day')
  @Roles('owner')
  @ApiZodBody(holidayChoiceSchema)
  chooseHoliday(
    @CurrentUser() user: AuthUser,
    @Param('day', new ZodValidationPipe(calendarDay('day'))) day: string,
    @Body(new ZodValidationPipe(holidayChoiceSchema)) dto: HolidayChoiceInput,
  ): Promise<HolidayChoiceResponse> {
    return this.settings.chooseHoliday(user, day, dto);
  }

  @ApiOperation({ summary: 'List shop closures' })
  @ApiZodResponse(z.array(responseSchemas.shopClosureViewSchema))
  @Get('closures')
  @Roles('owner')
  closures(): Promise<ShopClosureView[]> {
    return this.settings.closures();
  }

  @ApiOperation({ summary: 'Add a shop closure' })
  @ApiZodResponse(responseSchemas.addClosureResponseSchema)
  @Post('closures')
  @Roles('owner')
  @ApiZodBody(createClosureSchema)
  addClosure(@Body(new ZodValidationPipe(createClosureSchema)) dto: CreateClosureInput): Promise<AddClosureResponse> {
    return this.settings.addClosure(dto);
  }

  @ApiOperation({ summary: 'Remove a shop closure' })
  @Delete('closures/:id')
  @HttpCode(204)
  @Roles('owner')
  deleteClosure(@Param('id', uuidParam(requestWords.notAnId('a closure'))) id: string) {
    return this.settings.deleteClosure(id);
  }
}
