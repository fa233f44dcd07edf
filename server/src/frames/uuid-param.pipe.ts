// Path ids must be UUIDs: anything else is a 422 naming the parameter (not a database error).
import { PipeTransform } from '@nestjs/common';
import { DomainError } from '../common/errors/domain-error.js';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export class UuidParamPipe implements PipeTransform<string, string> {
  constructor(private readonly field = 'id') {}

  transform(value: string): string {
    if (!UUID.test(value)) {
      throw new DomainError('invalid_input', `${this.field} must be a UUID.`, [
        { field: this.field, reason: 'must be a UUID' },
      ]);
    }
    return value.toLowerCase();
  }
}
