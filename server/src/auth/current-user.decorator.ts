import { createParamDecorator, ExecutionContext } from '@nestjs/common';
import type { Request } from 'express';
import type { Role } from '../users/user.entity';

/** Who is asking: taken from a verified access token, never from the request body. */
export interface Actor {
  userId: string;
  businessId: string;
  role: Role;
  /** For the `customer` role: the customer record they are. */
  customerId?: string;
}

export const CurrentUser = createParamDecorator((_: unknown, ctx: ExecutionContext): Actor => {
  const req = ctx.switchToHttp().getRequest<Request & { user: Actor }>();
  return req.user;
});
