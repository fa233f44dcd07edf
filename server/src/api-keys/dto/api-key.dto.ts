import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { IsIn, IsInt, IsISO8601, IsOptional, IsString, Length, Max, Min } from 'class-validator';

const trim = ({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value);

export class CreateApiKeyRequestDto {
  @ApiProperty({ minLength: 1, maxLength: 100, example: 'Booking app (production)' })
  @Transform(trim)
  @IsString()
  @Length(1, 100)
  name: string;

  @ApiProperty({ enum: ['test', 'live'], example: 'live' })
  @IsIn(['test', 'live'])
  environment: 'test' | 'live';

  @ApiPropertyOptional({
    format: 'date-time',
    description: 'When the key stops working (at most 3 years ahead). Omit for no expiry.',
    example: '2027-06-30T00:00:00Z',
  })
  @IsOptional()
  @IsISO8601({ strict: true })
  expiresAt?: string;
}

export class RotateApiKeyRequestDto {
  @ApiPropertyOptional({
    type: 'integer',
    minimum: 0,
    maximum: 604800,
    default: 86400,
    description:
      'How long the old secret keeps working, in seconds (0 = stop at once; max 7 days).',
    example: 3600,
  })
  @IsOptional()
  @IsInt()
  @Min(0)
  @Max(604800)
  gracePeriodSeconds?: number;
}

export class ApiKeyCreatorDto {
  @ApiProperty({ format: 'uuid' })
  id: string;

  @ApiProperty({ example: 'Sabe Thornquist' })
  name: string;
}

export class ApiKeyResponseDto {
  @ApiProperty({ format: 'uuid' })
  id: string;

  @ApiProperty({ example: 'Booking app (production)' })
  name: string;

  @ApiProperty({ enum: ['test', 'live'] })
  environment: 'test' | 'live';

  @ApiProperty({ description: 'The visible start of the key.', example: 'lw_live_4fQk2ZbX9mTa' })
  prefix: string;

  @ApiProperty({ enum: ['active', 'revoked', 'expired'] })
  status: 'active' | 'revoked' | 'expired';

  @ApiProperty({ type: ApiKeyCreatorDto, nullable: true })
  createdBy: ApiKeyCreatorDto | null;

  @ApiProperty({ format: 'date-time' })
  createdAt: string;

  @ApiProperty({ format: 'date-time', nullable: true, type: String })
  expiresAt: string | null;

  @ApiProperty({
    format: 'date-time',
    nullable: true,
    type: String,
    description: 'Accurate to ~5 s.',
  })
  lastUsedAt: string | null;

  @ApiProperty({ format: 'date-time', nullable: true, type: String })
  revokedAt: string | null;

  @ApiProperty({ format: 'date-time', nullable: true, type: String })
  rotatedAt: string | null;

  @ApiProperty({
    format: 'date-time',
    nullable: true,
    type: String,
    description: 'Until when the secret replaced by the last rotation still works.',
  })
  previousSecretExpiresAt: string | null;
}

export class ApiKeyCreatedResponseDto extends ApiKeyResponseDto {
  @ApiProperty({
    description: 'The full key. Shown only in this response: store it now.',
    example: 'lw_live_4fQk2ZbX9mTa_8c1Vt0yQeR5nW2aJk7LmP3sD6fGh9ZxC',
  })
  secret: string;
}

export class ApiKeyPageResponseDto {
  @ApiProperty({ type: [ApiKeyResponseDto] })
  data: ApiKeyResponseDto[];

  @ApiProperty({ nullable: true, type: String })
  nextCursor: string | null;
}
