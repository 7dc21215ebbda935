import { SetMetadata } from '@nestjs/common';
import type { Role } from '../users/user.entity';

export const ROLES_KEY = 'roles';
/** Roles allowed on a route; a signed-in user of any other role gets 403. */
export const Roles = (...roles: Role[]) => SetMetadata(ROLES_KEY, roles);
