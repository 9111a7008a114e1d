import { responseSchemas } from '@loomwright/shared/dist/response-schemas';
import { Body, Controller, HttpCode, Post, Query } from '@nestjs/common';
import { ApiBadRequestResponse, ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import { estimateQuerySchema, estimateView, rigConfigurationSchema, type EstimateQuery, type RigConfiguration } from '@loomwright/shared';
import { Public } from '../auth/public.decorator';
import { ApiZodBody, ApiZodQuery, ApiZodResponse } from '../common/zod-openapi';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
import { EstimatesService } from './estimates.service';

@ApiTags('estimates')
@Controller('estimates')
export class EstimatesController {
  constructor(private readonly estimates: EstimatesService) {}

  @Public()
  @ApiOperation({ summary: 'Estimate a configuration' })
  @ApiZodResponse(responseSchemas.estimatePanelSchema)
  @Post()
  @HttpCode(200)
  @ApiZodBody(rigConfigurationSchema)
  @ApiZodQuery(estimateQuerySchema)
  @ApiOkResponse({
    description:
      'An itemized estimate with the rig checks; every amount a decimal string. With ?view=panel, the same without the ' +
      "signal chain's device list and the cable schedule's per-cable and per-lead lists.",
  })
  @ApiBadRequestResponse({ description: 'One message per field that needs fixing.' })
  async estimate(
    @Body(new ZodValidationPipe(rigConfigurationSchema)) config: RigConfiguration,
    @Query(new ZodValidationPipe(estimateQuerySchema)) query: EstimateQuery,
  ) {
    return estimateView(await this.estimates.price(config), query.view);
  }
}
