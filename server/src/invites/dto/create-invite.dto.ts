import { Transform } from 'class-transformer';
import { IsEmail, IsString, MaxLength, MinLength } from 'class-validator';

export class CreateInviteDto {
  @Transform(({ value }: { value: unknown }) =>
    typeof value === 'string' ? value.trim().toLowerCase() : value,
  )
  @IsEmail({}, { message: 'email must be an e-mail address' })
  @MaxLength(254)
  email: string;

  /** The helper's name as the owner knows it. */
  @IsString()
  @MinLength(1)
  @MaxLength(120)
  name: string;
}

export class AcceptInviteDto {
  @IsString()
  @MinLength(1)
  @MaxLength(120)
  name: string;

  @IsString()
  @MinLength(10, { message: 'password must be at least 10 characters' })
  @MaxLength(200)
  password: string;
}

export class InviteDto {
  id: string;
  email: string;
  name: string;
  expiresAt: Date;
  acceptedAt: Date | null;
  /** Only present right after creation: the single-use link to hand to the helper. */
  link?: string;
}
