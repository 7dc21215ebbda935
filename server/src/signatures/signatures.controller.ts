import { Body, Controller, Get, Post, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { type Actor, CurrentUser } from '../auth/current-user.decorator';
import { CommandBus } from '../commands/command-bus.service';
import { CaptureSignatureDto, SignatureQueryDto } from './dto/signature.dto';
import { Signature } from './signature.entity';
import { SignaturesService } from './signatures.service';

@ApiTags('signatures')
@ApiBearerAuth()
@Controller('signatures')
export class SignaturesController {
  constructor(
    private readonly signatures: SignaturesService,
    private readonly bus: CommandBus,
  ) {}

  /** Stores a signature after checking the record's hash; signatures are never changed. */
  @Post()
  capture(@CurrentUser() actor: Actor, @Body() dto: CaptureSignatureDto): Promise<Signature> {
    return this.bus.execute(actor, 'signature.capture', dto);
  }

  @Get()
  list(@CurrentUser() actor: Actor, @Query() query: SignatureQueryDto): Promise<Signature[]> {
    return this.signatures.list(actor, query);
  }
}
