import { Body, Controller, HttpCode, HttpStatus, Param, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { SessionDto } from '../auth/dto/session.dto';
import { Public } from '../auth/public.decorator';
import { Roles } from '../auth/roles.decorator';
import { CommandBus } from '../commands/command-bus.service';
import { CustomerLinksService } from './customer-links.service';
import { CustomerLinkDto, SendCustomerLinkDto } from './dto/customer-link.dto';

@ApiTags('customers')
@Controller('customer-links')
export class CustomerLinksController {
  constructor(
    private readonly links: CustomerLinksService,
    private readonly bus: CommandBus,
  ) {}

  /** E-mails the customer a sign-in link: single use, good for CUSTOMER_LINK_HOURS (72 h). */
  @ApiBearerAuth()
  @Roles('owner')
  @Post()
  send(@CurrentUser() actor: Actor, @Body() dto: SendCustomerLinkDto): Promise<CustomerLinkDto> {
    return this.bus.execute(actor, 'customer.sendLink', dto);
  }

  /** Signs the customer in with the link's token and spends it; used or expired is 410. */
  @Public()
  @HttpCode(HttpStatus.OK)
  @Post(':token/redeem')
  redeem(@Param('token') token: string): Promise<SessionDto> {
    return this.links.redeem(token);
  }
}
