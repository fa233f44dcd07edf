// Path ids must be UUIDs: anything else names no test frame, so it is the same 404 (naming the
// parameter) as an unknown id, as on every other route with an id in its path — never a database
// error.
import { PipeTransform } from '@nestjs/common';
import { DomainError } from '../common/errors/domain-error.js';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export class FrameIdPipe implements PipeTransform<string, string> {
  constructor(private readonly field = 'id') {}

  transform(value: string): string {
    if (!UUID.test(value)) {
      throw new DomainError('not_found', 'No test frame with this id in your organisation.', [
        { field: this.field, reason: 'is not a test frame of your organisation (ids are UUIDs)' },
      ]);
    }
    return value.toLowerCase();
  }
}
