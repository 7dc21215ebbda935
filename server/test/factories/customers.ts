import type { NestExpressApplication } from '@nestjs/platform-express';
import { DataSource } from 'typeorm';
import { AuthService } from '../../src/auth/auth.service';
import { User } from '../../src/users/user.entity';
import { type Session, uniqueEmail } from '../support/app';

/**
 * A signed-in customer: a `users` row with role customer for an existing customer record
 * (customers sign in by an e-mailed link, which comes later; the session is started directly).
 */
export async function signInCustomer(
  app: NestExpressApplication,
  businessId: string,
  customerId: string,
  label = 'customer',
): Promise<Session> {
  const ds = app.get(DataSource);
  const user = await ds.getRepository(User).save(
    ds.getRepository(User).create({
      businessId,
      email: uniqueEmail(label),
      name: 'Test Customer',
      role: 'customer',
      customerId,
      passwordHash: null,
    }),
  );
  return app.get(AuthService).startSession(user);
}
