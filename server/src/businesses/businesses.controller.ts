import { Body, Controller, Get, Patch } from '@nestjs/common';
import {
  ApiBearerAuth,
  ApiExtraModels,
  ApiOkResponse,
  ApiTags,
  getSchemaPath,
} from '@nestjs/swagger';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { CommandBus } from '../commands/command-bus.service';
import { BusinessesService } from './businesses.service';
import { BusinessDto, BusinessNameDto, UpdateBusinessDto } from './dto/business.dto';

@ApiTags('settings')
@ApiBearerAuth()
@Controller('business')
export class BusinessesController {
  constructor(
    private readonly businesses: BusinessesService,
    private readonly bus: CommandBus,
  ) {}

  /** The owner gets the profile and settings; a helper or a customer the business's name. */
  @Get()
  @ApiExtraModels(BusinessDto, BusinessNameDto)
  @ApiOkResponse({
    schema: {
      oneOf: [{ $ref: getSchemaPath(BusinessDto) }, { $ref: getSchemaPath(BusinessNameDto) }],
    },
  })
  get(@CurrentUser() actor: Actor): Promise<BusinessDto | BusinessNameDto> {
    return this.businesses.get(actor);
  }

  /** Name, time zone, currency and settings; each settings section sent replaces that section. */
  @Roles('owner')
  @Patch()
  update(@CurrentUser() actor: Actor, @Body() dto: UpdateBusinessDto): Promise<BusinessDto> {
    return this.bus.execute(actor, 'business.update', dto);
  }
}
