import { Transform } from 'class-transformer';
import { IsEmail, IsString, MaxLength, MinLength } from 'class-validator';

const lower = ({ value }: { value: unknown }) =>
  typeof value === 'string' ? value.trim().toLowerCase() : value;

export class SignInDto {
  /** @example owner@heronwake.example */
  @Transform(lower)
  @IsEmail({}, { message: 'email must be an e-mail address' })
  @MaxLength(254)
  email: string;

  @IsString()
  @MinLength(1, { message: 'password is required' })
  @MaxLength(200)
  password: string;
}

export class SignUpDto {
  /** The business's trading name. */
  @IsString()
  @MinLength(2)
  @MaxLength(120)
  businessName: string;

  /** The owner's name. */
  @IsString()
  @MinLength(1)
  @MaxLength(120)
  name: string;

  @Transform(lower)
  @IsEmail({}, { message: 'email must be an e-mail address' })
  @MaxLength(254)
  email: string;

  @IsString()
  @MinLength(10, { message: 'password must be at least 10 characters' })
  @MaxLength(200)
  password: string;
}

export class RefreshDto {
  @IsString()
  @MinLength(10)
  @MaxLength(300)
  refreshToken: string;
}
