import { Body, Controller, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { CommandBus } from '../commands/command-bus.service';
import { type ClimateAnswer } from './climate.service';
import { RecordClimateDto } from './dto/climate.dto';

/** Climate readings on site (°C); answers the dew point and the dew-point gate. */
@ApiTags('field')
@ApiBearerAuth()
@Roles('owner', 'tech')
@Controller('climate')
export class ClimateController {
  constructor(private readonly bus: CommandBus) {}

  @Post()
  record(@CurrentUser() actor: Actor, @Body() dto: RecordClimateDto): Promise<ClimateAnswer> {
    return this.bus.execute(actor, 'climate.record', dto);
  }
}
