import { Controller, Get, HttpStatus, Res } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import { InjectDataSource } from '@nestjs/typeorm';
import type { Response } from 'express';
import { DataSource } from 'typeorm';
import { Public } from '../auth/public.decorator';
import { RETRY_AFTER_SECONDS } from '../common/all-exceptions.filter';

export class HealthDto {
  status: 'ok' | 'degraded';
  database: 'up' | 'down';
  /** Migrations applied, newest last. */
  migrations: number;
}

export class LiveDto {
  status: 'ok';
}

@ApiTags('health')
@Controller('health')
export class HealthController {
  constructor(@InjectDataSource() private readonly db: DataSource) {}

  /** Answers at once with no database call: the process is up and serving requests. */
  @Public()
  @Get('live')
  live(): LiveDto {
    return { status: 'ok' };
  }

  /** Reports whether the database answers; 503 when it does not. */
  @Public()
  @Get()
  async check(@Res({ passthrough: true }) res: Response): Promise<HealthDto> {
    try {
      const rows: { n: string }[] = await this.db.query(
        'SELECT count(*)::text AS n FROM migrations',
      );
      return { status: 'ok', database: 'up', migrations: Number(rows[0]?.n ?? 0) };
    } catch {
      res
        .status(HttpStatus.SERVICE_UNAVAILABLE)
        .setHeader('Retry-After', String(RETRY_AFTER_SECONDS));
      return { status: 'degraded', database: 'down', migrations: 0 };
    }
  }
}
