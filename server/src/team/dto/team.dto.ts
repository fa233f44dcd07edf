import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { IsEmail, IsIn, IsOptional, IsString, Length, MaxLength } from 'class-validator';
import { ROLES, Role } from '../../common/decorators/access.decorator.js';

export class CreateInviteRequestDto {
  @ApiProperty({ example: 'noor@kestrelmoor.test' })
  @Transform(({ value }: { value: unknown }) =>
    typeof value === 'string' ? value.trim().toLowerCase() : value,
  )
  @IsEmail({}, { message: 'must be an e-mail address' })
  @MaxLength(254)
  email: string;

  @ApiProperty({ enum: ROLES, example: 'photographer' })
  @IsIn(ROLES)
  role: Role;
}

export class AcceptInviteRequestDto {
  @ApiProperty({ description: 'The token from the e-mailed link.' })
  @IsString()
  @Length(10, 200)
  token: string;

  @ApiPropertyOptional({
    description:
      'New accounts: your name. Not needed when already signed in as the invited address.',
    example: 'Noor Wickenden',
  })
  @IsOptional()
  @Transform(({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value))
  @IsString()
  @Length(1, 100)
  name?: string;

  @ApiPropertyOptional({
    description: 'New accounts: the password to set. Existing accounts: their current password.',
  })
  @IsOptional()
  @IsString()
  @MaxLength(200)
  password?: string;
}

export class InvitePreviewRequestDto {
  @ApiProperty({ description: 'The token from the e-mailed link.' })
  @IsString()
  @Length(10, 200)
  token: string;
}

export class InvitePreviewResponseDto {
  @ApiProperty({ example: 'Kestrelmoor Evening Portraits' })
  organizationName: string;

  @ApiProperty({ example: 'noor@kestrelmoor.test' })
  email: string;

  @ApiProperty({ enum: ROLES })
  role: Role;

  @ApiProperty({ format: 'date-time' })
  expiresAt: string;

  @ApiProperty({
    description: 'Whether the address already has an account (then sign in to accept).',
  })
  existingAccount: boolean;
}

export class MemberResponseDto {
  @ApiProperty({ format: 'uuid' })
  userId: string;

  @ApiProperty({ example: 'Corvin Daleholt' })
  name: string;

  @ApiProperty({ example: 'corvin@kestrelmoor.test' })
  email: string;

  @ApiProperty({ enum: ROLES })
  role: Role;

  @ApiProperty({ format: 'date-time' })
  joinedAt: string;
}

export class SeatsResponseDto {
  @ApiProperty({ description: "The plan's seats (plan.features.seats).", example: 10 })
  limit: number;

  @ApiProperty({
    description:
      'Seats taken: members plus pending invitations (not accepted, canceled or expired). A new invitation needs used < limit.',
    example: 3,
  })
  used: number;

  @ApiProperty({ description: 'Members of the organisation.', example: 2 })
  members: number;

  @ApiProperty({
    description: 'Invitations that can still be accepted (expired ones free their seat).',
    example: 1,
  })
  pendingInvites: number;

  @ApiProperty({ example: 'studio' })
  planCode: string;

  @ApiProperty({ example: 'Studio' })
  planName: string;
}

export class MemberListResponseDto {
  @ApiProperty({ type: [MemberResponseDto] })
  data: MemberResponseDto[];

  @ApiProperty({
    type: SeatsResponseDto,
    description:
      'Seats used against the plan. After a move to a smaller plan (e.g. a subscription ended), members may exceed the limit: everyone keeps access, but nobody new can be invited or join until members + pending invitations are under the limit.',
  })
  seats: SeatsResponseDto;
}

export class InviteResponseDto {
  @ApiProperty({ format: 'uuid' })
  id: string;

  @ApiProperty({ example: 'noor@kestrelmoor.test' })
  email: string;

  @ApiProperty({ enum: ROLES })
  role: Role;

  @ApiProperty({ enum: ['pending', 'expired', 'accepted', 'canceled'] })
  status: 'pending' | 'expired' | 'accepted' | 'canceled';

  @ApiProperty({ nullable: true, type: String, example: 'Ilse Marrowind' })
  invitedBy: string | null;

  @ApiProperty({ format: 'date-time' })
  expiresAt: string;

  @ApiProperty({ format: 'date-time' })
  lastSentAt: string;

  @ApiProperty({ format: 'date-time' })
  createdAt: string;
}

export class InviteListResponseDto {
  @ApiProperty({ type: [InviteResponseDto] })
  data: InviteResponseDto[];
}
