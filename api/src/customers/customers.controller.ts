import { BadRequestException, Controller, Get, Param, ParseUUIDPipe, Query } from '@nestjs/common';
import { ApiCookieAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { CustomerDetail, CustomerPage } from '@loomwright/shared';
import { Roles } from '../auth/roles.decorator';
import { CustomersService } from './customers.service';
import { ListCustomersDto } from './dto/list-customers.dto';

@ApiTags('customers')
@ApiCookieAuth('lw_session')
@Roles('builder', 'owner')
@Controller('customers')
export class CustomersController {
  constructor(private readonly customers: CustomersService) {}

  @Get()
  @ApiOkResponse({ description: 'A page of customers with their build counts (server-side sort and search).' })
  list(@Query() query: ListCustomersDto): Promise<CustomerPage> {
    return this.customers.list(query);
  }

  @Get(':id')
  @ApiOkResponse({ description: 'One customer with their builds, payments and the messages sent to them.' })
  detail(@Param('id', new ParseUUIDPipe({ exceptionFactory: () => new BadRequestException('The customer id in the address must be a UUID.') })) id: string): Promise<CustomerDetail> {
    return this.customers.detail(id);
  }
}
