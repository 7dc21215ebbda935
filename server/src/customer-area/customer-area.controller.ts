import { Controller, Get, HttpStatus, Param, ParseUUIDPipe, Put, Req, Res } from '@nestjs/common';
import { ApiBearerAuth, ApiConsumes, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { CustomerAreaService } from './customer-area.service';
import { ConditionRecordDto } from './dto/condition-record.dto';
import { CustomerAreaDto, SignatureImageDto } from './dto/customer-area.dto';
import type { SignatureImageRequest } from './signature-image-body.middleware';

/** The customer's own phone: their business, the image of a quote signature, a job's condition record. */
@ApiTags('customers')
@ApiBearerAuth()
@Controller()
export class CustomerAreaController {
  constructor(private readonly area: CustomerAreaService) {}

  /** Who the signed-in customer is, and their business's name, currency and time zone. */
  @Roles('customer')
  @Get('customer-area')
  get(@CurrentUser() actor: Actor): Promise<CustomerAreaDto> {
    return this.area.area(actor);
  }

  /**
   * The PNG of a signature over this quote (raw bytes, at most 512 KB), stored under its
   * SHA-256 for `signature.capture` to name. The owner, or the quote's customer once it was
   * sent. 201 when stored, 200 when it was already there.
   */
  @Roles('owner', 'customer')
  @ApiConsumes('image/png')
  @Put('quotes/:id/signature-image')
  async signatureImage(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
    @Req() req: SignatureImageRequest,
    @Res({ passthrough: true }) res: Response,
  ): Promise<SignatureImageDto> {
    const { blob, created } = await this.area.signatureImage(
      actor,
      id,
      req.body,
      req.signatureBodyError,
    );
    res.status(created ? HttpStatus.CREATED : HttpStatus.OK);
    return blob;
  }

  /**
   * The walkaround record read-only: notes, pins on the outline, photos, film readings per
   * panel before and after, the condition signatures with their hashes. The owner, the job's
   * helper and the job's customer.
   */
  @Roles('owner', 'tech', 'customer')
  @Get('jobs/:id/condition-record')
  conditionRecord(
    @CurrentUser() actor: Actor,
    @Param('id', ParseUUIDPipe) id: string,
  ): Promise<ConditionRecordDto> {
    return this.area.conditionRecord(actor, id);
  }
}
