import { RefreshToken } from '../auth/refresh-token.entity';
import { Business } from '../businesses/business.entity';
import { Invite } from '../invites/invite.entity';
import { User } from '../users/user.entity';

/** Every entity, listed once: the app module, the CLI data source and the tests use this. */
export const entities = [Business, User, RefreshToken, Invite];
