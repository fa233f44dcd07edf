// Small validation helpers shared by the gear and setups DTOs.
import { ApiProperty } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { ValidateIf } from 'class-validator';

export const trim = ({ value }: { value: unknown }) =>
  typeof value === 'string' ? value.trim() : value;

/** Empty or blank strings clear an optional text field. */
export const trimToNull = ({ value }: { value: unknown }) =>
  typeof value === 'string' ? value.trim() || null : value;

/** Optional, but `null` is validated (and so refused) rather than skipped. */
export const OptionalNotNull = () => ValidateIf((_o, v) => v !== undefined);

/** Optional and nullable: `null` clears the field. */
export const OptionalNullable = () => ValidateIf((_o, v) => v !== undefined && v !== null);

export const Trim = () => Transform(trim);
export const TrimToNull = () => Transform(trimToNull);

export const LENGTH_UNITS = ['m', 'ft'] as const;

/** `{data}` for short per-organisation lists (gear is tens of items, not thousands). */
export function listOf<T>(name: string, item: new () => T): new () => { data: T[] } {
  const Dto = { [name]: class {} }[name]!;
  ApiProperty({ type: [item] })(Dto.prototype, 'data');
  return Dto as new () => { data: T[] };
}
