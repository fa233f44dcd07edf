import { DomainError } from '../../common/errors/domain-error.js';
import { QuerySchemaPipe, type ObjectSchema } from './schema-dto.js';

const schema: ObjectSchema = {
  type: 'object',
  additionalProperties: false,
  properties: {
    limit: { type: 'integer', minimum: 1, maximum: 100 },
    ratio: { type: 'number' },
    cursor: { type: 'string', maxLength: 10 },
  },
};

const refusal = (query: Record<string, unknown>) => {
  try {
    new QuerySchemaPipe(schema).transform(query);
  } catch (e) {
    expect(e).toBeInstanceOf(DomainError);
    return (e as DomainError).errors;
  }
  throw new Error(`accepted ${JSON.stringify(query)}`);
};

describe('QuerySchemaPipe', () => {
  const pipe = new QuerySchemaPipe(schema);

  it('hands the handler numbers for numeric parameters and strings for the rest', () => {
    expect(pipe.transform({ limit: '20', cursor: '20' })).toEqual({ limit: 20, cursor: '20' });
    expect(pipe.transform({ ratio: '-1.25' })).toEqual({ ratio: -1.25 });
    expect(pipe.transform({})).toEqual({});
  });

  it('refuses every kind of bad whole number with the range in words, naming the parameter', () => {
    for (const limit of ['abc', '0', '1000', '1.5', '', '1e2', '0x10', ' 5', ['2', '3']]) {
      expect(refusal({ limit })).toEqual([
        { field: 'limit', reason: 'must be a whole number from 1 to 100' },
      ]);
    }
  });

  it('says "a number" for an unranged number and names unknown parameters', () => {
    expect(refusal({ ratio: 'x' })).toEqual([{ field: 'ratio', reason: 'must be a number' }]);
    expect(refusal({ page: '2' })).toEqual([{ field: 'page', reason: 'is not a known field' }]);
  });
});
