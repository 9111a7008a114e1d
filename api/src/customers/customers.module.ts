import { Module } from '@nestjs/common';
import { CustomersController } from './customers.controller';
import { CustomersRepository } from './customers.repository';
import { CustomersService } from './customers.service';

@Module({ controllers: [CustomersController], providers: [CustomersService, CustomersRepository], exports: [CustomersService] })
export class CustomersModule {}
