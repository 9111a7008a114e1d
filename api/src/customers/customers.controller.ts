import { responseSchemas } from '@loomwright/shared/dist/response-schemas';
import { Controller, Get, Param, Query } from '@nestjs/common';
import { uuidParam } from '../common/uuid-param.pipe';
import { ApiCookieAuth, ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import {
  listCustomersQuerySchema,
  type AuthUser,
  type CustomerDetail,
  type CustomerPage,
  type ListCustomersQuery,
  requestWords,
} from '@loomwright/shared';
import { CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { CustomersService } from './customers.service';
import { ApiZodQuery, ApiZodResponse } from '../common/zod-openapi';
import { ZodValidationPipe } from '../common/zod-validation.pipe';

@ApiTags('customers')
@ApiCookieAuth('lw_session')
@Roles('builder', 'owner')
@Controller('customers')
export class CustomersController {
  constructor(private readonly customers: CustomersService) {}

  @ApiOperation({ summary: 'List customers, a page at a time' })
  @ApiZodResponse(responseSchemas.customerPageSchema)
  @Get()
  @ApiOkResponse({ description: 'A page of customers with their build counts (server-side sort and search).' })
  @ApiZodQuery(listCustomersQuerySchema)
  list(
    @CurrentUser() user: AuthUser,
    @Query(new ZodValidationPipe(listCustomersQuerySchema)) query: ListCustomersQuery,
  ): Promise<CustomerPage> {
    return this.customers.list(user, query);
  }

  @ApiOperation({ summary: 'One customer with builds, payments and messages' })
  @ApiZodResponse(responseSchemas.customerDetailSchema)
  @Get(':id')
  @ApiOkResponse({
    description:
      'One customer with their builds, payments and the messages sent to them. A builder sees the e-mail, phone and addresses only of customers with a build assigned to them.',
  })
  detail(@CurrentUser() user: AuthUser, @Param('id', uuidParam(requestWords.notAnId('a customer'))) id: string): Promise<CustomerDetail> {
    return this.customers.detail(user, id);
  }
}
