import { responseSchemas } from '@loomwright/shared/dist/response-schemas';
import { z } from 'zod';
import { BadRequestException, Body, Controller, Delete, Get, HttpCode, Param, Patch, Post, UseGuards } from '@nestjs/common';
import { Throttle, ThrottlerGuard } from '@nestjs/throttler';
import { ApiCreatedResponse, ApiNoContentResponse, ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import {
  configurationLinkSchema,
  errorResponse,
  duplicateConfigurationSchema,
  saveConfigurationSchema,
  SHORT_LINK_CODE,
  updateConfigurationSchema,
  type AuthUser,
  type ConfigurationLink,
  type SavedConfiguration,
  type SavedConfigurationSummary,
  type SharedConfiguration,
  type ConfigurationLinkInput,
  type DuplicateConfigurationInput,
  type RigConfiguration,
  type SaveConfigurationInput,
  type UpdateConfigurationInput,
} from '@loomwright/shared';
import { CurrentUser } from '../auth/current-user.decorator';
import { Public } from '../auth/public.decorator';
import { uuidParam } from '../common/uuid-param.pipe';
import { ApiZodBody, ApiZodResponse } from '../common/zod-openapi';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
import { ConfigurationsService } from './configurations.service';
import { ApiErrorCodes } from '../common/api-document';

const configurationIdPipe = uuidParam('This saved board could not be found; open it from your saved boards.');

/** A signed-in person's saved configurations: each sees and changes only their own (another's id is a 404). */
@ApiTags('saved configurations')
@Controller('configurations')
export class ConfigurationsController {
  constructor(private readonly configurations: ConfigurationsService) {}

  @ApiOperation({ summary: 'List your saved configurations' })
  @Get()
  @ApiZodResponse(z.array(responseSchemas.savedConfigurationSummarySchema))
  @ApiOkResponse({ description: 'Your saved configurations, the most recently changed first.' })
  list(@CurrentUser() user: AuthUser): Promise<SavedConfigurationSummary[]> {
    return this.configurations.list(user);
  }

  @ApiOperation({ summary: 'Save a configuration' })
  @ApiErrorCodes('conflict')
  @Post()
  @ApiCreatedResponse({ description: 'The configuration, kept under its name.' })
  @ApiZodBody(saveConfigurationSchema)
  @ApiZodResponse(responseSchemas.savedConfigurationSchema)
  save(
    @CurrentUser() user: AuthUser,
    @Body(new ZodValidationPipe(saveConfigurationSchema)) body: SaveConfigurationInput,
  ): Promise<SavedConfiguration> {
    return this.configurations.save(user, body);
  }

  @ApiOperation({ summary: 'One saved configuration' })
  @Get(':id')
  @ApiZodResponse(responseSchemas.savedConfigurationSchema)
  @ApiOkResponse({ description: 'One of your saved configurations, whole.' })
  get(@CurrentUser() user: AuthUser, @Param('id', configurationIdPipe) id: string): Promise<SavedConfiguration> {
    return this.configurations.get(user, id);
  }

  @ApiOperation({ summary: 'Rename or change a saved configuration' })
  @ApiErrorCodes('conflict')
  @Patch(':id')
  @ApiOkResponse({ description: 'Renamed, or saved with changes.' })
  @ApiZodBody(updateConfigurationSchema)
  @ApiZodResponse(responseSchemas.savedConfigurationSchema)
  update(
    @CurrentUser() user: AuthUser,
    @Param('id', configurationIdPipe) id: string,
    @Body(new ZodValidationPipe(updateConfigurationSchema)) body: UpdateConfigurationInput,
  ): Promise<SavedConfiguration> {
    return this.configurations.update(user, id, body);
  }

  @ApiOperation({ summary: 'Copy a saved configuration' })
  @ApiErrorCodes('conflict')
  @Post(':id/duplicate')
  @ApiCreatedResponse({ description: 'A copy under the name given, or "<name> (copy)".' })
  @ApiZodBody(duplicateConfigurationSchema)
  @ApiZodResponse(responseSchemas.savedConfigurationSchema)
  duplicate(
    @CurrentUser() user: AuthUser,
    @Param('id', configurationIdPipe) id: string,
    @Body(new ZodValidationPipe(duplicateConfigurationSchema)) body: DuplicateConfigurationInput,
  ): Promise<SavedConfiguration> {
    return this.configurations.duplicate(user, id, body.name);
  }

  @ApiOperation({ summary: 'Delete a saved configuration' })
  @Delete(':id')
  @HttpCode(204)
  @ApiNoContentResponse({ description: 'Deleted.' })
  remove(@CurrentUser() user: AuthUser, @Param('id', configurationIdPipe) id: string) {
    return this.configurations.remove(user, id);
  }
}

/** Short links: a code stands for a configuration, so the address to share is a few characters long. */
@ApiTags('saved configurations')
@Controller('configuration-links')
export class ConfigurationLinksController {
  constructor(private readonly configurations: ConfigurationsService) {}

  // Open to anyone, so bounded per client address (the same PostgreSQL-backed counts as sign-in):
  // far above what a player clicking "Copy link" needs.
  @Public()
  @ApiOperation({ summary: 'Make a short link to a configuration' })
  @Post()
  @UseGuards(ThrottlerGuard)
  @Throttle({ 'address-and-email': { limit: 60, ttl: 60_000 }, address: { limit: 60, ttl: 60_000 } })
  @ApiCreatedResponse({ description: '{ code, path }: the storefront path /c/<code> opens this configuration.' })
  @ApiZodBody(configurationLinkSchema)
  @ApiZodResponse(responseSchemas.configurationLinkSchema)
  create(@Body(new ZodValidationPipe(configurationLinkSchema)) body: ConfigurationLinkInput): Promise<ConfigurationLink> {
    return this.configurations.link(body.configuration as RigConfiguration);
  }

  @Public()
  @ApiOperation({ summary: 'Open a short link' })
  @Get(':code')
  @ApiZodResponse(responseSchemas.sharedConfigurationSchema)
  @ApiOkResponse({ description: '{ configuration } the code stands for.' })
  open(@Param('code') code: string): Promise<SharedConfiguration> {
    if (!SHORT_LINK_CODE.test(code))
      throw new BadRequestException(
        errorResponse(
          'invalid_id',
          'This link is not complete: a shared board link ends in 6 to 16 letters and digits, as in /c/Ab3dE9xQ.',
        ),
      );
    return this.configurations.openLink(code);
  }
}
