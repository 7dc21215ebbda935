import type { Role } from '../../users/user.entity';

export class SessionUserDto {
  id: string;
  email: string;
  name: string;
  role: Role;
  businessId: string;
  businessName: string;
}

/** What a successful sign-in, sign-up, refresh or invite acceptance answers. */
export class SessionDto {
  accessToken: string;
  refreshToken: string;
  /** Seconds until the access token expires. */
  expiresIn: number;
  user: SessionUserDto;
}
