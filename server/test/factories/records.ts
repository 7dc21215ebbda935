import type { NestExpressApplication } from '@nestjs/platform-express';
import { randomUUID } from 'node:crypto';
import { http, type Session } from '../support/app';

export interface JobFixture {
  customerId: string;
  vehicleId: string;
  jobId: string;
}

const day = 86_400_000;

/** A customer, their vehicle and a booked job, made through the API as the owner would. */
export async function makeJob(
  app: NestExpressApplication,
  owner: Session,
  opts: {
    bodyStyle?: string;
    techId?: string | null;
    startInDays?: number;
    priceMinor?: number;
  } = {},
): Promise<JobFixture> {
  const customerId = randomUUID();
  const vehicleId = randomUUID();
  const jobId = randomUUID();
  const auth = { type: 'bearer' as const };
  await http(app)
    .post('/api/customers')
    .auth(owner.accessToken, auth)
    .send({
      id: customerId,
      name: 'Ada Fernhill',
      email: 'ada@customers.example',
      address: '4 Gull Lane, Larkspur Bay',
    })
    .expect(201);
  await http(app)
    .post('/api/vehicles')
    .auth(owner.accessToken, auth)
    .send({
      id: vehicleId,
      customerId,
      make: 'Generic',
      model: 'Estate',
      bodyStyle: opts.bodyStyle ?? 'wagon',
      colour: 'green',
    })
    .expect(201);
  const start = Date.now() + (opts.startInDays ?? 1) * day;
  await http(app)
    .post('/api/jobs')
    .auth(owner.accessToken, auth)
    .send({
      id: jobId,
      customerId,
      vehicleId,
      windowStart: new Date(start).toISOString(),
      windowEnd: new Date(start + 3 * 3_600_000).toISOString(),
      assignedTechId: opts.techId ?? null,
      priceMinor: opts.priceMinor ?? 45_000,
    })
    .expect(201);
  return { customerId, vehicleId, jobId };
}
