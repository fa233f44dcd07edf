import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsIn, IsNumber, IsString, Length, Max, MaxLength, Min } from 'class-validator';
import { MODIFIER_NAMES, type LengthUnit, type ModifierName } from '@lumenwright/shared';
import {
  LENGTH_UNITS,
  listOf,
  OptionalNotNull,
  OptionalNullable,
  Trim,
  TrimToNull,
} from './common.js';

class ModifierFieldsDto {
  @ApiPropertyOptional({
    enum: MODIFIER_NAMES,
    nullable: true,
    description: 'Kind of modifier (sets size defaults in the setup math); null = unspecified.',
    example: 'octabox',
  })
  @OptionalNullable()
  @IsIn(MODIFIER_NAMES)
  kind?: ModifierName | null;

  @ApiPropertyOptional({
    minimum: 1,
    maximum: 180,
    nullable: true,
    type: Number,
    description: 'Full beam angle of a grid or reflector, degrees (1..180).',
    example: 20,
  })
  @OptionalNullable()
  @IsNumber()
  @Min(1)
  @Max(180)
  beamAngleDeg?: number | null;

  @ApiPropertyOptional({
    minimum: 0.01,
    maximum: 10,
    nullable: true,
    type: Number,
    description: 'Diameter or diagonal (0.01..10), in sizeUnit.',
    example: 0.9,
  })
  @OptionalNullable()
  @IsNumber()
  @Min(0.01)
  @Max(10)
  size?: number | null;

  @ApiPropertyOptional({ enum: LENGTH_UNITS, default: 'm', description: 'Unit of size.' })
  @OptionalNotNull()
  @IsIn(LENGTH_UNITS)
  sizeUnit?: LengthUnit;

  @ApiPropertyOptional({ maxLength: 2000, nullable: true, type: String })
  @TrimToNull()
  @OptionalNullable()
  @IsString()
  @MaxLength(2000)
  notes?: string | null;
}

export class CreateModifierRequestDto extends ModifierFieldsDto {
  @ApiProperty({ minLength: 1, maxLength: 80, example: '90 cm octa' })
  @Trim()
  @IsString()
  @Length(1, 80)
  name: string;

  @ApiPropertyOptional({
    minimum: 0,
    maximum: 8,
    description:
      'Light lost in the modifier, stops (0..8). Default: the typical loss for its kind.',
    example: 2,
  })
  @OptionalNotNull()
  @IsNumber()
  @Min(0)
  @Max(8)
  lossStops?: number;
}

export class UpdateModifierRequestDto extends ModifierFieldsDto {
  @ApiPropertyOptional({ minLength: 1, maxLength: 80 })
  @Trim()
  @OptionalNotNull()
  @IsString()
  @Length(1, 80)
  name?: string;

  @ApiPropertyOptional({
    minimum: 0,
    maximum: 8,
    description: 'Light lost in the modifier, stops (0..8).',
    example: 2,
  })
  @OptionalNotNull()
  @IsNumber()
  @Min(0)
  @Max(8)
  lossStops?: number;
}

export class ModifierResponseDto {
  @ApiProperty({ format: 'uuid' }) id: string;
  @ApiProperty({ example: '90 cm octa' }) name: string;
  @ApiProperty({ enum: MODIFIER_NAMES, nullable: true }) kind: ModifierName | null;
  @ApiProperty({ description: 'Light loss, stops.', example: 2 }) lossStops: number;
  @ApiProperty({ nullable: true, type: Number, description: 'Beam angle, degrees.' })
  beamAngleDeg: number | null;
  @ApiProperty({ nullable: true, type: Number }) size: number | null;
  @ApiProperty({ enum: LENGTH_UNITS, nullable: true }) sizeUnit: LengthUnit | null;
  @ApiProperty({ nullable: true, type: String }) notes: string | null;
  @ApiProperty({ format: 'date-time' }) createdAt: string;
  @ApiProperty({ format: 'date-time' }) updatedAt: string;
}

export const ModifierListResponseDto = listOf('ModifierListResponseDto', ModifierResponseDto);
