import { Body, Controller, Get, HttpCode, HttpStatus, Post, UseGuards } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { AuthService } from './auth.service';
import { type Actor, CurrentUser } from './current-user.decorator';
import { RefreshDto, SignInDto, SignUpDto } from './dto/sign-in.dto';
import { SessionDto, SessionUserDto } from './dto/session.dto';
import { Public } from './public.decorator';
import { SignInThrottlerGuard } from './sign-in-throttler.guard';

@ApiTags('auth')
@Controller('auth')
export class AuthController {
  constructor(private readonly auth: AuthService) {}

  /** An owner starts a new business and is signed in. */
  @Public()
  @UseGuards(SignInThrottlerGuard)
  @Post('sign-up')
  signUp(@Body() dto: SignUpDto): Promise<SessionDto> {
    return this.auth.signUp(dto);
  }

  @Public()
  @UseGuards(SignInThrottlerGuard)
  @HttpCode(HttpStatus.OK)
  @Post('sign-in')
  signIn(@Body() dto: SignInDto): Promise<SessionDto> {
    return this.auth.signIn(dto.email, dto.password);
  }

  /** Swaps a refresh token for a new pair; the old one is spent. */
  @Public()
  @HttpCode(HttpStatus.OK)
  @Post('refresh')
  refresh(@Body() dto: RefreshDto): Promise<SessionDto> {
    return this.auth.refresh(dto.refreshToken);
  }

  @Public()
  @HttpCode(HttpStatus.NO_CONTENT)
  @Post('sign-out')
  async signOut(@Body() dto: RefreshDto): Promise<void> {
    await this.auth.signOut(dto.refreshToken);
  }

  @ApiBearerAuth()
  @Get('me')
  me(@CurrentUser() actor: Actor): Promise<SessionUserDto> {
    return this.auth.sessionUser(actor.userId);
  }
}
