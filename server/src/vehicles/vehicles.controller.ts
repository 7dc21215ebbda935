import {
  Body,
  Controller,
  Delete,
  Get,
  HttpCode,
  HttpStatus,
  Param,
  ParseUUIDPipe,
  Patch,
  Post,
  Query,
} from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { CommandBus } from '../commands/command-bus.service';
import { IfMatchVersion } from '../common/if-match';
import { CreateVehicleDto, UpdateVehicleBodyDto, VehicleQueryDto } from './dto/vehicle.dto';
import { Vehicle } from './vehicle.entity';
import { VehiclesService } from './vehicles.service';

@ApiTags('clients')
@ApiBearerAuth()
@Controller('vehicles')
export class VehiclesController {
  constructor(
    private readonly vehicles: VehiclesService,
    private readonly bus: CommandBus,
  ) {}

  @Roles('owner', 'customer')
  @Get()
  list(@CurrentUser() actor: Actor, @Query() query: VehicleQueryDto): Promise<Vehicle[]> {
    return this.vehicles.list(actor, query);
  }

  @Roles('owner')
  @Post()
  create(@CurrentUser() actor: Actor, @Body() dto: CreateVehicleDto): Promise<Vehicle> {
    return this.bus.execute(actor, 'vehicle.create', dto);
  }

  @Roles('owner', 'customer')
  @Get(':id')
  get(@CurrentUser() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<Vehicle> {
    return this.vehicles.get(actor, id);
  }

  @Roles('owner')
  @Patch(':id')
  update(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() dto: UpdateVehicleBodyDto,
    @IfMatchVersion() expectedVersion?: number,
  ): Promise<Vehicle> {
    return this.bus.execute(actor, 'vehicle.update', { ...dto, id, expectedVersion });
  }

  @Roles('owner')
  @Delete(':id')
  @HttpCode(HttpStatus.NO_CONTENT)
  async remove(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @IfMatchVersion() expectedVersion?: number,
  ): Promise<void> {
    await this.bus.execute(actor, 'vehicle.remove', { id, expectedVersion });
  }
}
