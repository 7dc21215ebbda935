import { Body, Controller, Get, Post, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { CommandBus } from '../commands/command-bus.service';
import type { Page } from '../common/dto/page.dto';
import { AttachPhotoDto, PhotoQueryDto } from './dto/photo.dto';
import { Photo } from './photo.entity';
import { PhotosService } from './photos.service';

@ApiTags('photos')
@ApiBearerAuth()
@Controller('photos')
export class PhotosController {
  constructor(
    private readonly photos: PhotosService,
    private readonly bus: CommandBus,
  ) {}

  /** Records a photo whose image was uploaded with PUT /api/blobs/:sha256. */
  @Roles('owner', 'tech')
  @Post()
  attach(@CurrentUser() actor: Actor, @Body() dto: AttachPhotoDto): Promise<Photo> {
    return this.bus.execute(actor, 'photo.attach', dto);
  }

  /** Photos of a job (?jobId) or a vehicle (?vehicleId) that the caller may see. */
  @Get()
  list(@CurrentUser() actor: Actor, @Query() query: PhotoQueryDto): Promise<Page<Photo>> {
    return this.photos.list(actor, query);
  }
}
