import { num, str } from '../compute/schemas/common.js';
import { UUID_PATTERN as UUID, type JsonSchema } from '../compute/validation/json-schema.js';
import { schemaDto, type ObjectSchema } from '../compute/validation/schema-dto.js';

export const ENDPOINTS = [
  'twilight',
  'exposure',
  'flash',
  'falloff',
  'backlight',
  'balance',
  'setup',
  'timeline',
  'frames',
];
const DATE = '^\\d{4}-\\d{2}-\\d{2}$';
const INSTANT =
  '^\\d{4}-\\d{2}-\\d{2}(T\\d{2}:\\d{2}(:\\d{2}(\\.\\d{1,6})?)?(Z|[+-]\\d{2}:\\d{2}))?$';
const INSTANT_WORDS = 'a date (YYYY-MM-DD) or an ISO 8601 date-time with Z or an offset';
// Query values arrive as strings; QuerySchemaPipe reads the numeric ones as numbers, so the
// spec types them as whole numbers with their range.
const status = (description: string): JsonSchema => ({
  type: 'integer',
  minimum: 100,
  maximum: 599,
  example: 429,
  description: `${description} A whole number from 100 to 599.`,
});

export const summaryQuerySchema: ObjectSchema = {
  type: 'object',
  additionalProperties: false,
  properties: {
    from: str('First UTC day, YYYY-MM-DD; default the first of this month.', '2026-12-01', {
      pattern: DATE,
      format: 'date',
    }),
    to: str('Last UTC day (inclusive), YYYY-MM-DD; default today.', '2026-12-31', {
      pattern: DATE,
      format: 'date',
    }),
    keyId: str('Only calls made with this API key.', undefined, { pattern: UUID, format: 'uuid' }),
    endpoint: str('Only calls to this endpoint.', 'balance', { enum: ENDPOINTS }),
    status: status('Only calls answered with this HTTP status.'),
    outcome: str('Only failed calls (4xx or 5xx: "error") or the others ("ok").', 'error', {
      enum: ['ok', 'error'],
    }),
  },
};

export const eventsQuerySchema: ObjectSchema = {
  type: 'object',
  additionalProperties: false,
  properties: {
    keyId: str('Only this API key.', undefined, { pattern: UUID, format: 'uuid' }),
    endpoint: str('Only this endpoint.', 'balance', { enum: ENDPOINTS }),
    status: status('Only this HTTP status.'),
    outcome: str('Only failed calls (4xx or 5xx: "error") or the others ("ok").', 'error', {
      enum: ['ok', 'error'],
    }),
    from: str('From this instant (inclusive), ISO 8601 or YYYY-MM-DD (UTC).', '2026-12-01', {
      pattern: INSTANT,
      patternWords: INSTANT_WORDS,
    }),
    to: str('Before this instant (exclusive), ISO 8601 or YYYY-MM-DD (UTC).', undefined, {
      pattern: INSTANT,
      patternWords: INSTANT_WORDS,
    }),
    limit: {
      type: 'integer',
      minimum: 1,
      maximum: 200,
      default: 50,
      example: 50,
      description: 'Page size, a whole number from 1 to 200; default 50.',
    },
    cursor: str('nextCursor from the previous page.', undefined, { maxLength: 200 }),
  },
};

const group = (key: string, keySchema: JsonSchema): JsonSchema => ({
  type: 'array',
  items: {
    type: 'object',
    required: [key, 'calls', 'billableUnits', 'errors', 'meanLatencyMs'],
    properties: {
      [key]: keySchema,
      calls: num('Calls.', 120),
      billableUnits: num('Billable units.', 118),
      errors: num('Calls that got a 4xx or 5xx.', 2),
      meanLatencyMs: {
        type: ['number', 'null'],
        description: 'Mean server time, milliseconds.',
        example: 0.8,
      },
    },
  },
});

export const UsageSummaryResponseDto = schemaDto('UsageSummaryResponseDto', {
  type: 'object',
  required: ['from', 'to', 'totals', 'byDay', 'byEndpoint', 'byKey', 'byStatus', 'bySource'],
  properties: {
    from: str('First day.', '2026-12-01'),
    to: str('Last day (inclusive).', '2026-12-31'),
    totals: {
      type: 'object',
      required: ['calls', 'billableUnits', 'errors', 'meanLatencyMs'],
      properties: {
        calls: num('Calls.', 1830),
        billableUnits: num('Billable units.', 1498),
        errors: num('Calls that got a 4xx or 5xx.', 12),
        meanLatencyMs: { type: ['number', 'null'], description: 'Mean server time, ms.' },
      },
    },
    byDay: group('day', str('UTC day.', '2026-12-02')),
    byEndpoint: group('endpoint', str('Endpoint.', 'balance')),
    byKey: group('keyId', { type: ['string', 'null'], description: 'API key id (null: console).' }),
    byStatus: group('status', num('HTTP status.', 200)),
    bySource: group('source', str('live, test or console.', 'live')),
  },
});

export const usageEventSchema: ObjectSchema = {
  type: 'object',
  required: [
    'id',
    'occurredAt',
    'keyId',
    'userId',
    'source',
    'endpoint',
    'status',
    'latencyMs',
    'billableUnits',
    'requestId',
  ],
  properties: {
    id: str('Event id.'),
    occurredAt: str('When the call finished (ISO 8601, UTC).', '2026-12-02T18:41:07.120Z'),
    keyId: { type: ['string', 'null'], description: 'API key id; null for console calls.' },
    userId: { type: ['string', 'null'], description: 'Console user; null for key calls.' },
    source: str('live, test or console.', 'live', { enum: ['live', 'test', 'console'] }),
    endpoint: str('Endpoint called.', 'balance', { enum: ENDPOINTS }),
    status: num('HTTP status returned.', 200),
    latencyMs: num('Server time, milliseconds.', 0.74),
    billableUnits: num('Units billed (1 for a successful live call, else 0).', 1),
    requestId: str('The X-Request-Id of the call.'),
  },
};

export const UsageEventResponseDto = schemaDto('UsageEventResponseDto', usageEventSchema);

export const UsageEventPageResponseDto = schemaDto('UsageEventPageResponseDto', {
  type: 'object',
  required: ['data', 'nextCursor'],
  properties: {
    data: { type: 'array', items: usageEventSchema },
    nextCursor: {
      type: ['string', 'null'],
      description: 'Pass as cursor for the next page; null at the end.',
    },
  },
});
