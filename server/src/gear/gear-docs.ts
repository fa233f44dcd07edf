// Documented problem responses shared by the gear and setups routes.
import { applyDecorators } from '@nestjs/common';
import { problem } from '../common/decorators/problem-responses.js';

export { problem };

/**
 * 404 when `withId`; 422 (+409) on writes. 401, and 403 where the role or the CSRF check can
 * refuse, come from the access rule (src/openapi-problems.ts).
 */
export function GearProblems(opts: { withId?: boolean; write?: boolean } = {}) {
  return applyDecorators(
    ...(opts.withId
      ? [problem(404, 'No such item in your organisation; `errors` names the field.')]
      : []),
    ...(opts.write
      ? [
          problem(409, 'The name is already used in your organisation; `errors` names the field.'),
          problem(
            422,
            'A field is missing, of the wrong type or out of range; `errors` names each.',
          ),
        ]
      : []),
  );
}
