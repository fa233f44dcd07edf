import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import {
  IsIn,
  IsNumber,
  IsObject,
  IsOptional,
  IsString,
  Length,
  Max,
  MaxLength,
  Min,
  ValidateNested,
} from 'class-validator';
import type { LengthUnit } from '@lumenwright/shared';
import {
  LENGTH_UNITS,
  listOf,
  OptionalNotNull,
  OptionalNullable,
  Trim,
  TrimToNull,
} from './common.js';

/** One flash-meter reading of the light at full power (or a known power), ISO 100 by default. */
export class MeterReadingDto {
  @ApiProperty({
    minimum: 0.7,
    maximum: 128,
    description: 'f-number the meter read (0.7..128).',
    example: 8,
  })
  @IsNumber()
  @Min(0.7)
  @Max(128)
  aperture: number;

  @ApiProperty({
    minimum: 0.05,
    maximum: 1000,
    description: 'Light-to-meter distance (0.05..1000), in distanceUnit.',
    example: 5,
  })
  @IsNumber()
  @Min(0.05)
  @Max(1000)
  distance: number;

  @ApiPropertyOptional({ enum: LENGTH_UNITS, default: 'm', description: 'Metres or feet.' })
  @IsOptional()
  @IsIn(LENGTH_UNITS)
  distanceUnit?: LengthUnit;

  @ApiPropertyOptional({
    minimum: 3,
    maximum: 409600,
    description: 'ISO set on the meter (3..409600); default 100.',
    example: 100,
  })
  @IsOptional()
  @IsNumber()
  @Min(3)
  @Max(409600)
  iso?: number;

  @ApiPropertyOptional({
    minimum: 1 / 4096,
    maximum: 1,
    description: 'Power fraction during the reading (1/4096..1); default 1 (full power).',
    example: 1,
  })
  @IsOptional()
  @IsNumber()
  @Min(1 / 4096)
  @Max(1)
  powerFraction?: number;
}

export class CreateLightRequestDto {
  @ApiProperty({ minLength: 1, maxLength: 80, example: 'Key strobe A' })
  @Trim()
  @IsString()
  @Length(1, 80)
  name: string;

  @ApiPropertyOptional({
    minimum: 1,
    maximum: 500,
    description:
      'Guide number at ISO 100, full power (1..500), in guideNumberUnit. Send this or meterReading.',
    example: 60,
  })
  @OptionalNotNull()
  @IsNumber()
  @Min(1)
  @Max(500)
  guideNumber?: number;

  @ApiPropertyOptional({
    enum: LENGTH_UNITS,
    default: 'm',
    description: 'Unit of the guide number.',
  })
  @OptionalNotNull()
  @IsIn(LENGTH_UNITS)
  guideNumberUnit?: LengthUnit;

  @ApiPropertyOptional({
    type: MeterReadingDto,
    description:
      'A meter reading to derive the guide number from (GN = f-number × distance at ISO 100, full power).',
  })
  @OptionalNotNull()
  @IsObject()
  @ValidateNested()
  @Type(() => MeterReadingDto)
  meterReading?: MeterReadingDto;

  @ApiPropertyOptional({
    maxLength: 2000,
    nullable: true,
    type: String,
    example: 'Spare battery in the red case.',
  })
  @TrimToNull()
  @OptionalNullable()
  @IsString()
  @MaxLength(2000)
  notes?: string | null;
}

export class UpdateLightRequestDto {
  @ApiPropertyOptional({ minLength: 1, maxLength: 80 })
  @Trim()
  @OptionalNotNull()
  @IsString()
  @Length(1, 80)
  name?: string;

  @ApiPropertyOptional({
    minimum: 1,
    maximum: 500,
    description: 'New guide number (replaces any meter reading).',
    example: 58,
  })
  @OptionalNotNull()
  @IsNumber()
  @Min(1)
  @Max(500)
  guideNumber?: number;

  @ApiPropertyOptional({ enum: LENGTH_UNITS, description: 'Unit of guideNumber; send with it.' })
  @OptionalNotNull()
  @IsIn(LENGTH_UNITS)
  guideNumberUnit?: LengthUnit;

  @ApiPropertyOptional({
    type: MeterReadingDto,
    description: 'A new meter reading (replaces the guide number).',
  })
  @OptionalNotNull()
  @IsObject()
  @ValidateNested()
  @Type(() => MeterReadingDto)
  meterReading?: MeterReadingDto;

  @ApiPropertyOptional({ maxLength: 2000, nullable: true, type: String })
  @TrimToNull()
  @OptionalNullable()
  @IsString()
  @MaxLength(2000)
  notes?: string | null;
}

export class MeterReadingResponseDto {
  @ApiProperty({ example: 8 }) aperture: number;
  @ApiProperty({ example: 5 }) distance: number;
  @ApiProperty({ enum: LENGTH_UNITS }) distanceUnit: LengthUnit;
  @ApiProperty({ example: 100 }) iso: number;
  @ApiProperty({ example: 1 }) powerFraction: number;
}

export class LightResponseDto {
  @ApiProperty({ format: 'uuid' }) id: string;
  @ApiProperty({ example: 'Key strobe A' }) name: string;
  @ApiProperty({
    description: 'Guide number at ISO 100, full power, in guideNumberUnit.',
    example: 60,
  })
  guideNumber: number;
  @ApiProperty({ enum: LENGTH_UNITS }) guideNumberUnit: LengthUnit;
  @ApiProperty({ description: 'The guide number in metres.', example: 60 }) guideNumberM: number;
  @ApiProperty({ description: 'The guide number in feet.', example: 196.85 }) guideNumberFt: number;
  @ApiProperty({
    type: MeterReadingResponseDto,
    nullable: true,
    description: 'The reading the guide number was derived from; null when entered as rated.',
  })
  meterReading: MeterReadingResponseDto | null;
  @ApiProperty({ nullable: true, type: String }) notes: string | null;
  @ApiProperty({ format: 'date-time' }) createdAt: string;
  @ApiProperty({ format: 'date-time' }) updatedAt: string;
}

export const LightListResponseDto = listOf('LightListResponseDto', LightResponseDto);
