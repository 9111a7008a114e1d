import { Module } from '@nestjs/common';
import { EstimatesModule } from '../estimates/estimates.module';
import { ConfigurationLinksController, ConfigurationsController } from './configurations.controller';
import { ConfigurationsRepository } from './configurations.repository';
import { ConfigurationsService } from './configurations.service';

@Module({
  imports: [EstimatesModule],
  controllers: [ConfigurationsController, ConfigurationLinksController],
  providers: [ConfigurationsService, ConfigurationsRepository],
  exports: [ConfigurationsService],
})
export class ConfigurationsModule {}
