import type { LengthUnit } from '@lumenwright/shared';
import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Transform, Type } from 'class-transformer';
import {
  IsEmail,
  IsIn,
  IsObject,
  IsString,
  IsUUID,
  Length,
  MaxLength,
  ValidateNested,
} from 'class-validator';
import { ROLES, Role } from '../../common/decorators/access.decorator.js';
import { LENGTH_UNITS, OptionalNotNull } from '../../gear/dto/common.js';

const trim = ({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value);
const email = ({ value }: { value: unknown }) =>
  typeof value === 'string' ? value.trim().toLowerCase() : value;

export class SignUpRequestDto {
  @ApiProperty({ example: 'ilse@kestrelmoor.test', maxLength: 254 })
  @Transform(email)
  @IsEmail({}, { message: 'must be an e-mail address' })
  @MaxLength(254)
  email: string;

  @ApiProperty({ minLength: 10, maxLength: 200, example: 'long-dusk-over-the-pier' })
  @IsString()
  @MaxLength(200)
  password: string;

  @ApiProperty({ minLength: 1, maxLength: 100, example: 'Ilse Marrowind' })
  @Transform(trim)
  @IsString()
  @Length(1, 100)
  name: string;

  @ApiProperty({ minLength: 1, maxLength: 100, example: 'Kestrelmoor Evening Portraits' })
  @Transform(trim)
  @IsString()
  @Length(1, 100)
  organizationName: string;
}

export class SignInRequestDto {
  @ApiProperty({ example: 'ilse@kestrelmoor.test' })
  @Transform(email)
  @IsEmail({}, { message: 'must be an e-mail address' })
  @MaxLength(254)
  email: string;

  @ApiProperty({ example: 'long-dusk-over-the-pier' })
  @IsString()
  @Length(1, 200)
  password: string;
}

export class PasswordResetRequestDto {
  @ApiProperty({ example: 'ilse@kestrelmoor.test' })
  @Transform(email)
  @IsEmail({}, { message: 'must be an e-mail address' })
  @MaxLength(254)
  email: string;
}

export class PasswordResetConfirmRequestDto {
  @ApiProperty({ description: 'The token from the e-mailed link.', example: 'q3Zk…' })
  @IsString()
  @Length(10, 200)
  token: string;

  @ApiProperty({ minLength: 10, maxLength: 200, example: 'a-new-blue-hour-phrase' })
  @IsString()
  @MaxLength(200)
  password: string;
}

export class TokenRequestDto {
  @ApiProperty({ description: 'The token from the e-mailed link.', example: 'q3Zk…' })
  @IsString()
  @Length(10, 200)
  token: string;
}

export class UserPreferencesDto {
  @ApiProperty({
    enum: LENGTH_UNITS,
    example: 'ft',
    description: 'Metres or feet for distances in the console.',
  })
  @IsIn(LENGTH_UNITS)
  lengthUnit: LengthUnit;
}

/** Send `name`, `preferences`, or both; at least one. */
export class UpdateProfileRequestDto {
  @ApiPropertyOptional({ minLength: 1, maxLength: 100, example: 'Ilse Marrowind' })
  @Transform(trim)
  @OptionalNotNull()
  @IsString()
  @Length(1, 100)
  name?: string;

  @ApiPropertyOptional({ type: UserPreferencesDto })
  @OptionalNotNull()
  @IsObject()
  @ValidateNested()
  @Type(() => UserPreferencesDto)
  preferences?: UserPreferencesDto;
}

export class ChangePasswordRequestDto {
  @ApiProperty({ example: 'long-dusk-over-the-pier' })
  @IsString()
  @Length(1, 200)
  currentPassword: string;

  @ApiProperty({ minLength: 10, maxLength: 200, example: 'a-new-blue-hour-phrase' })
  @IsString()
  @MaxLength(200)
  newPassword: string;
}

export class EmailChangeRequestDto {
  @ApiProperty({ example: 'ilse.m@kestrelmoor.test' })
  @Transform(email)
  @IsEmail({}, { message: 'must be an e-mail address' })
  @MaxLength(254)
  newEmail: string;

  @ApiProperty({ description: 'The current password, to confirm it is you.' })
  @IsString()
  @Length(1, 200)
  password: string;
}

export class SwitchOrganizationRequestDto {
  @ApiProperty({ format: 'uuid' })
  @IsUUID()
  organizationId: string;
}

export class UserResponseDto {
  @ApiProperty({ format: 'uuid' })
  id: string;

  @ApiProperty({ example: 'ilse@kestrelmoor.test' })
  email: string;

  @ApiProperty({ example: 'Ilse Marrowind' })
  name: string;

  @ApiProperty({ format: 'date-time' })
  createdAt: string;
}

export class OrganizationResponseDto {
  @ApiProperty({ format: 'uuid' })
  id: string;

  @ApiProperty({ example: 'Kestrelmoor Evening Portraits' })
  name: string;

  @ApiProperty({ example: 'free' })
  planCode: string;

  @ApiProperty({ format: 'date-time' })
  createdAt: string;
}

export class MeResponseDto {
  @ApiProperty({ type: UserResponseDto })
  user: UserResponseDto;

  @ApiProperty({ type: OrganizationResponseDto })
  organization: OrganizationResponseDto;

  @ApiProperty({ enum: ROLES, example: 'owner' })
  role: Role;

  @ApiProperty({
    type: [String],
    description: 'Permissions of this role (see the permission table).',
    example: ['keys:manage-own', 'playground:use'],
  })
  permissions: string[];

  @ApiProperty({ type: UserPreferencesDto, description: 'The signed-in user’s own settings.' })
  preferences: UserPreferencesDto;
}

export class MyOrganizationResponseDto {
  @ApiProperty({ type: OrganizationResponseDto })
  organization: OrganizationResponseDto;

  @ApiProperty({ enum: ROLES })
  role: Role;

  @ApiProperty({ description: 'The organisation this session acts for.' })
  current: boolean;
}

export class MyOrganizationsResponseDto {
  @ApiProperty({ type: [MyOrganizationResponseDto] })
  data: MyOrganizationResponseDto[];
}

export class EmailStateResponseDto {
  @ApiProperty({
    description: 'The address you sign in with now.',
    example: 'ilse@kestrelmoor.test',
  })
  email: string;

  @ApiProperty({
    type: String,
    nullable: true,
    description: 'An address asked for and not yet confirmed from its mail (the latest), or null.',
    example: 'ilse.m@kestrelmoor.test',
  })
  pendingEmail: string | null;

  @ApiProperty({
    type: String,
    nullable: true,
    description: 'When the confirmation link for pendingEmail stops working (ISO 8601), or null.',
  })
  pendingUntil: string | null;
}

export class AcceptedResponseDto {
  @ApiProperty({ example: 'If the address belongs to an account, a message is on its way.' })
  message: string;
}

export class RoleRequestDto {
  @ApiProperty({ enum: ROLES, example: 'developer' })
  @IsIn(ROLES)
  role: Role;
}
