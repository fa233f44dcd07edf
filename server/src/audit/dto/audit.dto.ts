import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsOptional, IsString, Matches } from 'class-validator';
import { PageQueryDto } from './page-query.dto.js';

export class AuditListQueryDto extends PageQueryDto {
  @ApiPropertyOptional({ description: 'Only this action.', example: 'key.revoked' })
  @IsOptional()
  @IsString()
  @Matches(/^[a-z_]+\.[a-z_]+$/, { message: 'must look like "key.revoked"' })
  action?: string;
}

export class AuditActorDto {
  @ApiProperty({ nullable: true, type: String, format: 'uuid' })
  userId: string | null;

  @ApiProperty({ nullable: true, type: String, example: 'Ilse Marrowind' })
  name: string | null;

  @ApiProperty({
    nullable: true,
    type: String,
    format: 'uuid',
    description: 'Set when an API key acted.',
  })
  keyId: string | null;
}

export class AuditEventResponseDto {
  @ApiProperty({ format: 'uuid' })
  id: string;

  @ApiProperty({ example: 'key.created' })
  action: string;

  @ApiProperty({ type: AuditActorDto })
  actor: AuditActorDto;

  @ApiProperty({ nullable: true, type: String, example: 'api_key' })
  targetType: string | null;

  @ApiProperty({ nullable: true, type: String, example: '2f5c7c3e-3f0e-4d7a-9f59-8d1f4f0c2b11' })
  targetId: string | null;

  @ApiProperty({ nullable: true, type: String, example: '127.0.0.1' })
  ip: string | null;

  @ApiProperty({ nullable: true, type: String, example: 'Mozilla/5.0' })
  userAgent: string | null;

  @ApiProperty({ type: 'object', additionalProperties: true, example: { name: 'Booking app' } })
  metadata: Record<string, unknown>;

  @ApiProperty({ format: 'date-time' })
  createdAt: string;
}

export class AuditPageResponseDto {
  @ApiProperty({ type: [AuditEventResponseDto] })
  data: AuditEventResponseDto[];

  @ApiProperty({ nullable: true, type: String })
  nextCursor: string | null;
}
