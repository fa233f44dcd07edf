import { ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsInt, IsOptional, IsString, Max, MaxLength, Min } from 'class-validator';

/** Cursor pagination: pass back `nextCursor` as `cursor` until it is null. */
export class PageQueryDto {
  @ApiPropertyOptional({ type: 'integer', minimum: 1, maximum: 100, default: 20, example: 20 })
  @IsOptional()
  @Type(() => Number)
  @IsInt()
  @Min(1)
  @Max(100)
  limit?: number;

  @ApiPropertyOptional({
    description: 'The `nextCursor` of the previous page.',
    example: 'MmY1Y2...',
  })
  @IsOptional()
  @IsString()
  @MaxLength(200)
  cursor?: string;
}
