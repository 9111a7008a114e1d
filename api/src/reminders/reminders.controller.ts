import { Body, Controller, Get, Patch } from '@nestjs/common';
import { responseSchemas } from '@loomwright/shared/dist/response-schemas';
import { ApiCookieAuth, ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import {
  updateReminderSettingsSchema,
  type AuthUser,
  type ReminderSettingsView,
  type UpdateReminderSettingsInput,
} from '@loomwright/shared';
import { CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { ApiZodBody, ApiZodResponse } from '../common/zod-openapi';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
import { RemindersService } from './reminders.service';

/** The reminders' part of the shop settings: each on or off, and when it goes out. */
@ApiTags('settings')
@ApiCookieAuth('lw_session')
@Controller('settings/reminders')
export class RemindersController {
  constructor(private readonly reminders: RemindersService) {}

  @ApiOperation({ summary: 'The reminders the shop sends, and when' })
  @ApiZodResponse(responseSchemas.reminderSettingsViewSchema)
  @Get()
  @Roles('builder', 'owner')
  @ApiOkResponse({ description: 'Each reminder on or off, and its days (hours for an unfinished checkout).' })
  get(): Promise<ReminderSettingsView> {
    return this.reminders.settings();
  }

  @ApiOperation({ summary: 'Switch a reminder on or off, or change when it goes out' })
  @ApiZodResponse(responseSchemas.reminderSettingsViewSchema)
  @ApiOkResponse({ description: 'The reminder settings as they now stand.' })
  @Patch()
  @Roles('owner')
  @ApiZodBody(updateReminderSettingsSchema)
  update(
    @CurrentUser() user: AuthUser,
    @Body(new ZodValidationPipe(updateReminderSettingsSchema)) dto: UpdateReminderSettingsInput,
  ): Promise<ReminderSettingsView> {
    return this.reminders.updateSettings(dto, user.id);
  }
}
