import { Body, Controller, HttpCode, Post } from '@nestjs/common';
import { ApiBadRequestResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { rigConfigurationSchema, type RigConfiguration } from '@loomwright/shared';
import { Public } from '../auth/public.decorator';
import { ApiZodBody } from '../common/zod-openapi';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
import { EstimatesService } from './estimates.service';

@ApiTags('estimates')
@Controller('estimates')
export class EstimatesController {
  constructor(private readonly estimates: EstimatesService) {}

  @Public()
  @Post()
  @HttpCode(200)
  @ApiZodBody(rigConfigurationSchema)
  @ApiOkResponse({ description: 'An itemized estimate with the rig checks; every amount a decimal string.' })
  @ApiBadRequestResponse({ description: 'One message per field that needs fixing.' })
  estimate(@Body(new ZodValidationPipe(rigConfigurationSchema)) config: RigConfiguration) {
    return this.estimates.price(config);
  }
}
