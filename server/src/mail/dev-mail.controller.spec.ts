import type { ConfigService } from '@nestjs/config';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Actor } from '../auth/current-user.decorator';
import type { EnvironmentVariables } from '../config/env.validation';
import { CaptureStore } from '../fakes/smtp/capture-store';
import { DevMailController } from './dev-mail.controller';

const owner: Actor = { userId: 'u', businessId: 'b-1', role: 'owner' };

function controller(dir: string, env: Partial<EnvironmentVariables>): DevMailController {
  const values: Partial<EnvironmentVariables> = {
    MAIL_CAPTURE_DIR: dir,
    MAIL_CAPTURE: false,
    ...env,
  };
  const config = { get: (k: keyof EnvironmentVariables) => values[k] };
  return new DevMailController(config as unknown as ConfigService<EnvironmentVariables, true>);
}

describe('the dev inbox', () => {
  let dir: string;
  beforeEach(async () => {
    dir = await mkdtemp(join(tmpdir(), 'dev-inbox-'));
    const raw = (business: string) =>
      Buffer.from(
        `From: a@x.example\r\nTo: b@x.example\r\nSubject: hi ${business}\r\nX-Panelpass-Business: ${business}\r\n\r\nhello\r\n`,
      );
    await new CaptureStore(dir).save(raw('b-1'), { from: 'a@x.example', to: ['b@x.example'] });
    await new CaptureStore(dir).save(raw('b-2'), { from: 'a@x.example', to: ['b@x.example'] });
  });
  afterEach(() => rm(dir, { recursive: true, force: true }));

  it('lists only the asking business’s messages outside production', async () => {
    const list = await controller(dir, { NODE_ENV: 'development' }).list(owner);
    expect(list.items.map((m) => m.subject)).toEqual(['hi b-1']);
  });

  it('is off in production (404) unless MAIL_CAPTURE=1', async () => {
    await expect(controller(dir, { NODE_ENV: 'production' }).list(owner)).rejects.toMatchObject({
      status: 404,
    });
    const on = controller(dir, { NODE_ENV: 'production', MAIL_CAPTURE: true });
    expect((await on.list(owner)).items).toHaveLength(1);
  });
});
