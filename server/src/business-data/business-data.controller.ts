import {
  Body,
  Controller,
  Delete,
  Get,
  HttpCode,
  Query,
  Res,
  StreamableFile,
} from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { BusinessDataService } from './business-data.service';
import { DeleteBusinessDto, DeletedBusinessDto, ExportQueryDto } from './dto/business-data.dto';

/** The owner's own copy of all of the business's data, and deleting the business. */
@ApiTags('settings')
@ApiBearerAuth()
@Roles('owner')
@Controller('business')
export class BusinessDataController {
  constructor(private readonly data: BusinessDataService) {}

  /**
   * Everything of the business: `?format=json` one JSON document (a manifest, then every
   * table's rows), `?format=csv` a zip of one RFC 4180 CSV per table with a README.txt.
   * Password hashes and token hashes are never included; images are listed by SHA-256.
   */
  @ApiProduces('application/json', 'application/zip')
  @ApiOkResponse({ schema: { type: 'string', format: 'binary' } })
  @Get('export')
  async export(
    @CurrentUser() actor: Actor,
    @Query() query: ExportQueryDto,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    const file = await this.data.exportAll(actor, query.format ?? 'json');
    res.setHeader('Cache-Control', 'private, no-store');
    res.setHeader('X-Content-Type-Options', 'nosniff');
    return new StreamableFile(file.content, {
      type: file.type,
      disposition: `attachment; filename="${file.filename}"`,
      length: file.content.length,
    });
  }

  /**
   * Deletes the business and everything of it, for good: every record, image, person and
   * session; customers' links stop working. The body must carry the business's name.
   */
  @Delete()
  @HttpCode(200)
  delete(@CurrentUser() actor: Actor, @Body() dto: DeleteBusinessDto): Promise<DeletedBusinessDto> {
    return this.data.deleteBusiness(actor, dto);
  }
}
