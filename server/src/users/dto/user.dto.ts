import { IdArgs } from '../../common/dto/version.dto';
import type { Role } from '../user.entity';

/** A member of the team as the owner sees them (never a password hash). */
export class TeamMemberDto {
  id: string;
  email: string;
  name: string;
  role: Role;
  createdAt: Date;
}

/** `user.remove` (owner): a helper leaves the team. */
export class RemoveUserDto extends IdArgs {}
