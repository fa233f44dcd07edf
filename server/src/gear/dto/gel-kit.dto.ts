import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import {
  ArrayMaxSize,
  IsArray,
  IsNumber,
  IsString,
  Length,
  Max,
  MaxLength,
  Min,
  ValidateNested,
} from 'class-validator';
import { listOf, OptionalNotNull, OptionalNullable, Trim, TrimToNull } from './common.js';

/** Most pieces in one kit: the balance solver searches stacks over at most this many. */
export const MAX_GEL_PIECES = 30;

class GelPieceFieldsDto {
  @ApiPropertyOptional({
    minimum: -400,
    maximum: 400,
    description:
      'Mired shift (−400..400; + = warmer, CTO family; − = cooler, CTB family). Default 0.',
    example: 93,
  })
  @OptionalNotNull()
  @IsNumber()
  @Min(-400)
  @Max(400)
  miredShift?: number;

  @ApiPropertyOptional({
    minimum: -60,
    maximum: 60,
    description: 'Green shift, CC units (−60..60; + = plus-green, − = minus-green). Default 0.',
    example: 0,
  })
  @OptionalNotNull()
  @IsNumber()
  @Min(-60)
  @Max(60)
  greenShift?: number;
}

export class CreateGelPieceRequestDto extends GelPieceFieldsDto {
  @ApiProperty({ minLength: 1, maxLength: 60, example: '1/2 CTO' })
  @Trim()
  @IsString()
  @Length(1, 60)
  name: string;

  @ApiProperty({
    minimum: 0,
    maximum: 6,
    description: 'Light the gel absorbs, stops (0..6).',
    example: 0.4,
  })
  @IsNumber()
  @Min(0)
  @Max(6)
  lossStops: number;
}

export class UpdateGelPieceRequestDto extends GelPieceFieldsDto {
  @ApiPropertyOptional({ minLength: 1, maxLength: 60 })
  @Trim()
  @OptionalNotNull()
  @IsString()
  @Length(1, 60)
  name?: string;

  @ApiPropertyOptional({
    minimum: 0,
    maximum: 6,
    description: 'Light the gel absorbs, stops (0..6).',
  })
  @OptionalNotNull()
  @IsNumber()
  @Min(0)
  @Max(6)
  lossStops?: number;
}

export class CreateGelKitRequestDto {
  @ApiProperty({ minLength: 1, maxLength: 80, example: 'Studio gel kit' })
  @Trim()
  @IsString()
  @Length(1, 80)
  name: string;

  @ApiPropertyOptional({ maxLength: 2000, nullable: true, type: String })
  @TrimToNull()
  @OptionalNullable()
  @IsString()
  @MaxLength(2000)
  notes?: string | null;

  @ApiPropertyOptional({
    type: [CreateGelPieceRequestDto],
    maxItems: MAX_GEL_PIECES,
    description: `The kit's pieces (at most ${MAX_GEL_PIECES}); more can be added later.`,
  })
  @OptionalNotNull()
  @IsArray()
  @ArrayMaxSize(MAX_GEL_PIECES)
  @ValidateNested({ each: true })
  @Type(() => CreateGelPieceRequestDto)
  pieces?: CreateGelPieceRequestDto[];
}

export class UpdateGelKitRequestDto {
  @ApiPropertyOptional({ minLength: 1, maxLength: 80 })
  @Trim()
  @OptionalNotNull()
  @IsString()
  @Length(1, 80)
  name?: string;

  @ApiPropertyOptional({ maxLength: 2000, nullable: true, type: String })
  @TrimToNull()
  @OptionalNullable()
  @IsString()
  @MaxLength(2000)
  notes?: string | null;
}

export class GelPieceResponseDto {
  @ApiProperty({ format: 'uuid' }) id: string;
  @ApiProperty({ example: '1/2 CTO' }) name: string;
  @ApiProperty({ description: 'Mired shift (+ = warmer).', example: 93 }) miredShift: number;
  @ApiProperty({ description: 'Green shift, CC units.', example: 0 }) greenShift: number;
  @ApiProperty({ description: 'Light loss, stops.', example: 0.4 }) lossStops: number;
  @ApiProperty({ description: 'Order in the kit.', example: 0 }) position: number;
}

export class GelKitResponseDto {
  @ApiProperty({ format: 'uuid' }) id: string;
  @ApiProperty({ example: 'Studio gel kit' }) name: string;
  @ApiProperty({ nullable: true, type: String }) notes: string | null;
  @ApiProperty({ type: [GelPieceResponseDto] }) pieces: GelPieceResponseDto[];
  @ApiProperty({ format: 'date-time' }) createdAt: string;
  @ApiProperty({ format: 'date-time' }) updatedAt: string;
}

export const GelKitListResponseDto = listOf('GelKitListResponseDto', GelKitResponseDto);
