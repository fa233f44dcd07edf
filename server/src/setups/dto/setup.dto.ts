import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import {
  IsInt,
  IsObject,
  IsOptional,
  IsString,
  Length,
  Max,
  MaxLength,
  Min,
} from 'class-validator';
import { PageQueryDto } from '../../audit/dto/page-query.dto.js';
import { SetupResponseDto } from '../../compute/schemas/setup.schema.js';
import { schemaDto } from '../../compute/validation/schema-dto.js';
import { OptionalNotNull, OptionalNullable, Trim, TrimToNull } from '../../gear/dto/common.js';
import { gearSetupRequestSchema } from '../../gear/gear-refs.schema.js';

/** What POST /v1/setup takes, plus gear by id (`gelKitId`, `key.lightId`, `key.modifierId`, …). */
export const SavedSetupInputsDto = schemaDto('SavedSetupInputsDto', gearSetupRequestSchema);

export const NAME_MAX = 120;

export class CreateSavedSetupRequestDto {
  @ApiProperty({
    minLength: 1,
    maxLength: NAME_MAX,
    example: 'Engagement session, lakeside terrace',
  })
  @Trim()
  @IsString()
  @Length(1, NAME_MAX)
  name: string;

  @ApiPropertyOptional({
    maxLength: 200,
    nullable: true,
    type: String,
    example: 'Tallowmere boathouse terrace, Quillby-on-Wend',
  })
  @TrimToNull()
  @OptionalNullable()
  @IsString()
  @MaxLength(200)
  venue?: string | null;

  @ApiPropertyOptional({
    maxLength: 5000,
    nullable: true,
    type: String,
    example: 'Couple arrives 19:15. Jetty closes at dusk.',
  })
  @TrimToNull()
  @OptionalNullable()
  @IsString()
  @MaxLength(5000)
  notes?: string | null;

  @ApiProperty({
    type: SavedSetupInputsDto,
    description:
      'The setup inputs, as POST /v1/setup takes them; gear may be named by id. The plan is computed from them when saved. Date and time zone come from here.',
  })
  @IsObject()
  inputs: Record<string, unknown>;
}

export class UpdateSavedSetupRequestDto {
  @ApiPropertyOptional({ minLength: 1, maxLength: NAME_MAX })
  @Trim()
  @OptionalNotNull()
  @IsString()
  @Length(1, NAME_MAX)
  name?: string;

  @ApiPropertyOptional({ maxLength: 200, nullable: true, type: String })
  @TrimToNull()
  @OptionalNullable()
  @IsString()
  @MaxLength(200)
  venue?: string | null;

  @ApiPropertyOptional({ maxLength: 5000, nullable: true, type: String })
  @TrimToNull()
  @OptionalNullable()
  @IsString()
  @MaxLength(5000)
  notes?: string | null;

  @ApiPropertyOptional({
    type: SavedSetupInputsDto,
    description: 'New inputs: the plan is computed again.',
  })
  @OptionalNotNull()
  @IsObject()
  inputs?: Record<string, unknown>;
}

export class DuplicateSavedSetupRequestDto {
  @ApiPropertyOptional({
    minLength: 1,
    maxLength: NAME_MAX,
    description: 'Default: the name with " (copy)".',
  })
  @Trim()
  @OptionalNotNull()
  @IsString()
  @Length(1, NAME_MAX)
  name?: string;
}

export class ListSavedSetupsQueryDto extends PageQueryDto {
  @ApiPropertyOptional({
    maxLength: 100,
    description: 'Search in name, venue and notes (case-insensitive).',
    example: 'terrace',
  })
  @OptionalNotNull()
  @IsString()
  @MaxLength(100)
  q?: string;
}

export class SavedSetupAuthorDto {
  @ApiProperty({ format: 'uuid' }) id: string;
  @ApiProperty({ example: 'Orla Featherstone' }) name: string;
}

export class SavedSetupSummaryDto {
  @ApiProperty({ format: 'uuid' }) id: string;
  @ApiProperty({ example: 'Engagement session, lakeside terrace' }) name: string;
  @ApiProperty({ nullable: true, type: String }) venue: string | null;
  @ApiProperty({ nullable: true, type: String }) notes: string | null;
  @ApiProperty({ format: 'date', example: '2026-09-12', description: 'Local shoot date.' })
  date: string;
  @ApiProperty({ example: 'Europe/London' }) timeZone: string;
  @ApiProperty({
    nullable: true,
    type: String,
    description: 'Shooting window start, ISO 8601 with offset.',
  })
  windowStart: string | null;
  @ApiProperty({
    nullable: true,
    type: String,
    description: 'Shooting window end, ISO 8601 with offset.',
  })
  windowEnd: string | null;
  @ApiProperty({ type: SavedSetupAuthorDto, nullable: true }) createdBy: SavedSetupAuthorDto | null;
  @ApiProperty({ format: 'date-time' }) createdAt: string;
  @ApiProperty({ format: 'date-time' }) updatedAt: string;
}

export class SavedSetupResponseDto extends SavedSetupSummaryDto {
  @ApiProperty({
    type: SavedSetupInputsDto,
    description: 'The inputs as sent (gear may be named by id).',
  })
  inputs: Record<string, unknown>;

  @ApiProperty({
    type: SavedSetupInputsDto,
    description:
      'The inputs with gear resolved to the values used (reopen these in the playground).',
  })
  resolvedInputs: Record<string, unknown>;

  @ApiProperty({ type: SetupResponseDto, description: 'The plan, as POST /v1/setup returns it.' })
  plan: Record<string, unknown>;
}

export class SavedSetupPageResponseDto {
  @ApiProperty({ type: [SavedSetupSummaryDto] }) data: SavedSetupSummaryDto[];
  @ApiProperty({
    nullable: true,
    type: String,
    description: 'Pass as `cursor` for the next page; null at the end.',
  })
  nextCursor: string | null;
}

export class UpcomingSetupsQueryDto {
  @ApiPropertyOptional({ type: 'integer', minimum: 1, maximum: 10, default: 3, example: 3 })
  @IsOptional()
  @Type(() => Number)
  @IsInt()
  @Min(1)
  @Max(10)
  limit?: number;
}

export class UpcomingSetupsResponseDto {
  @ApiProperty({
    type: [SavedSetupSummaryDto],
    description: 'Soonest first: setups whose shooting window has not ended yet.',
  })
  data: SavedSetupSummaryDto[];
}
