// The published request examples are valid requests: each passes its endpoint's request schema
// and the math answers it with a response its schema describes (no refusal).
import { ComputeService } from '../compute.service.js';
import { compileSchema } from '../validation/json-schema.js';
import { COMPUTE_EXAMPLES } from './examples.js';
import { REQUEST_SCHEMAS, RESPONSE_SCHEMAS } from './index.js';

const service = new ComputeService();
type Endpoint =
  'twilight' | 'exposure' | 'flash' | 'falloff' | 'backlight' | 'balance' | 'setup' | 'timeline';

describe('compute request examples', () => {
  it('has examples for every compute endpoint', () => {
    expect(Object.keys(COMPUTE_EXAMPLES).sort()).toEqual(Object.keys(REQUEST_SCHEMAS).sort());
  });

  const cases = Object.entries(COMPUTE_EXAMPLES).flatMap(([endpoint, examples]) =>
    Object.entries(examples).map(([name, ex]) => [endpoint, name, ex.value] as const),
  );
  it.each(cases)('%s %s is a valid request the math answers', (endpoint, _name, value) => {
    expect(compileSchema(REQUEST_SCHEMAS[endpoint]!)(value)).toEqual([]);
    const answer = (service[endpoint as Endpoint] as (i: unknown) => unknown)(value);
    expect(compileSchema(RESPONSE_SCHEMAS[endpoint]!)(JSON.parse(JSON.stringify(answer)))).toEqual(
      [],
    );
  });

  it('the background example is answered in background mode (an estimated ambient)', () => {
    const r = service.exposure(
      COMPUTE_EXAMPLES.exposure!.backgroundAtDusk!.value as never,
    ) as unknown as { ambientSource: string };
    expect(r.ambientSource).toBe('place');
  });
});
