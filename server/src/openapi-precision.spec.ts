// The published spec says exactly what the code enforces and answers: every request DTO's
// class-validator bounds and closed sets are its minimum/maximum and enum, whole numbers are
// integers, and every answer's warning codes are the shared library's lists. And each DTO
// property's type check is the one its refusal names.
import type { INestApplication } from '@nestjs/common';
import type { OpenAPIObject } from '@nestjs/swagger';
import {
  BACKLIGHT_WARNING_CODES,
  BALANCE_WARNING_CODES,
  EXPOSURE_WARNING_CODES,
  FLASH_WARNING_CODES,
  FRAME_NOTE_CODES,
  FRAME_WARNING_CODES,
  MODIFIER_NAMES,
  SETUP_WARNING_CODES,
  TIMELINE_WARNING_CODES,
  TWILIGHT_WARNING_CODES,
} from '@lumenwright/shared';
import { getMetadataStorage } from 'class-validator';
import { createPreviewApp } from './app.factory.js';
import { buildOpenApiDocument } from './openapi.js';
import * as apiKeyDtos from './api-keys/dto/api-key.dto.js';
import * as auditDtos from './audit/dto/audit.dto.js';
import * as pageDtos from './audit/dto/page-query.dto.js';
import * as authDtos from './auth/dto/auth.dto.js';
import * as billingDtos from './billing/dto/billing.dto.js';
import * as gelKitDtos from './gear/dto/gel-kit.dto.js';
import * as lightDtos from './gear/dto/light.dto.js';
import * as modifierDtos from './gear/dto/modifier.dto.js';
import * as organizationDtos from './organizations/dto/organization.dto.js';
import * as setupDtos from './setups/dto/setup.dto.js';
import * as teamDtos from './team/dto/team.dto.js';

type Schema = {
  type?: string;
  enum?: unknown[];
  minimum?: number;
  maximum?: number;
  properties?: Record<string, Schema>;
  items?: Schema;
  allOf?: Schema[];
  $ref?: string;
};

const DTO_MODULES = [
  apiKeyDtos,
  auditDtos,
  pageDtos,
  authDtos,
  billingDtos,
  gelKitDtos,
  lightDtos,
  modifierDtos,
  organizationDtos,
  setupDtos,
  teamDtos,
];

/** Query DTOs are published as parameters: where each one is read. */
const QUERY_DTOS: Record<string, string[]> = {
  PageQueryDto: ['/v1/keys'],
  AuditListQueryDto: ['/v1/audit'],
  ListSavedSetupsQueryDto: ['/v1/setups'],
  UpcomingSetupsQueryDto: ['/v1/setups/upcoming'],
};

interface Rules {
  min?: number;
  max?: number;
  oneOf?: unknown[];
  integer?: boolean;
}

/** What class-validator enforces on each property of a DTO class (its own and inherited). */
function rulesOf(cls: new () => object): Map<string, Rules> {
  const out = new Map<string, Rules>();
  for (const m of getMetadataStorage().getTargetValidationMetadatas(cls, '', true, false)) {
    const r = out.get(m.propertyName) ?? {};
    if (m.name === 'min') r.min = m.constraints[0];
    if (m.name === 'max') r.max = m.constraints[0];
    if (m.name === 'isIn') r.oneOf = m.constraints[0];
    if (m.name === 'isInt') r.integer = true;
    out.set(m.propertyName, r);
  }
  return out;
}

const dtoClasses = DTO_MODULES.flatMap((mod) =>
  Object.values(mod).filter(
    (v): v is new () => object => typeof v === 'function' && /Dto$/.test(v.name),
  ),
);

/** class-validator checks that say what kind of value a field takes. */
const TYPE_CHECKS = new Set([
  'isString',
  'isInt',
  'isNumber',
  'isBoolean',
  'isArray',
  'isObject',
  'isIn',
  'isEnum',
  'isUUID',
  'isISO8601',
  'isEmail',
]);

describe('DTO refusals name the type first', () => {
  // The validation pipe reports one problem per field: the check registered last, which is the
  // top decorator in the source (decorators apply bottom-up). So the type check must be on top,
  // or a number sent for a name would be told "must be longer than…" instead of "must be a string".
  it.each(dtoClasses.map((c) => [c.name, c] as const))('%s', (_name, cls) => {
    const checks = new Map<string, string[]>();
    for (const m of getMetadataStorage().getTargetValidationMetadatas(cls, '', true, false)) {
      if (m.type !== 'customValidation' || !m.name) continue;
      checks.set(m.propertyName, [...(checks.get(m.propertyName) ?? []), m.name]);
    }
    const misplaced = [...checks]
      .filter(([, names]) => names.some((n) => TYPE_CHECKS.has(n)))
      .filter(([, names]) => !TYPE_CHECKS.has(names[names.length - 1]!))
      .map(([prop, names]) => `${prop}: ${names.join(' < ')}`);
    expect(misplaced).toEqual([]);
  });
});

describe('the spec is as precise as the code', () => {
  let app: INestApplication;
  let doc: OpenAPIObject;
  let schemas: Record<string, Schema>;
  beforeAll(async () => {
    app = await createPreviewApp();
    doc = buildOpenApiDocument(app);
    schemas = doc.components!.schemas as Record<string, Schema>;
  }, 60000);
  afterAll(async () => {
    await app?.close();
  });

  /** The published schema of one property, following a single `allOf: [$ref]` wrapper. */
  const published = (cls: string, prop: string): Schema | undefined => {
    if (QUERY_DTOS[cls]) {
      const params = QUERY_DTOS[cls].map(
        (path) =>
          (doc.paths[path]!.get!.parameters as { name: string; schema: Schema }[]).find(
            (p) => p.name === prop,
          )?.schema,
      );
      expect(new Set(params.map((p) => JSON.stringify(p))).size).toBe(1);
      return params[0];
    }
    return schemas[cls]?.properties?.[prop];
  };

  it('publishes every class-validator bound, closed set and whole number of the request DTOs', () => {
    const checked: string[] = [];
    const wrong: string[] = [];
    for (const cls of dtoClasses) {
      if (!schemas[cls.name] && !QUERY_DTOS[cls.name]) continue; // not in the document
      for (const [prop, r] of rulesOf(cls)) {
        const s = published(cls.name, prop);
        if (!s) continue;
        const where = `${cls.name}.${prop}`;
        if (r.min !== undefined && s.minimum !== r.min)
          wrong.push(`${where} minimum ${s.minimum} ≠ ${r.min}`);
        if (r.max !== undefined && s.maximum !== r.max)
          wrong.push(`${where} maximum ${s.maximum} ≠ ${r.max}`);
        // A nullable field lists null besides the values class-validator checks.
        const values = s.enum?.filter((v) => v !== null);
        if (r.oneOf && JSON.stringify(values) !== JSON.stringify(r.oneOf))
          wrong.push(`${where} enum ${JSON.stringify(values)} ≠ ${JSON.stringify(r.oneOf)}`);
        if (r.integer && s.type !== 'integer') wrong.push(`${where} type ${s.type} ≠ integer`);
        if (r.min !== undefined || r.max !== undefined || r.oneOf || r.integer) checked.push(where);
      }
    }
    expect(wrong).toEqual([]);
    // The gear writes are among them (light, meter reading, gel piece).
    expect(checked).toEqual(
      expect.arrayContaining([
        'CreateLightRequestDto.guideNumber',
        'MeterReadingDto.aperture',
        'CreateGelPieceRequestDto.lossStops',
        'PageQueryDto.limit',
      ]),
    );
  });

  it("publishes each answer's warning codes as the shared library's lists", () => {
    const codes = (s: Schema | undefined) => s?.items?.properties?.code?.enum;
    const response = (name: string) => schemas[name]!.properties!;
    expect(codes(response('ExposureResponseDto').warnings)).toEqual([...EXPOSURE_WARNING_CODES]);
    expect(codes(response('FlashResponseDto').warnings)).toEqual([...FLASH_WARNING_CODES]);
    expect(codes(response('BacklightResponseDto').warnings)).toEqual([...BACKLIGHT_WARNING_CODES]);
    expect(codes(response('BalanceResponseDto').warnings)).toEqual([...BALANCE_WARNING_CODES]);
    expect(codes(response('TwilightResponseDto').warnings)).toEqual([...TWILIGHT_WARNING_CODES]);
    expect(codes(response('SetupResponseDto').warnings)).toEqual([...SETUP_WARNING_CODES]);
    expect(codes(response('TimelineResponseDto').warnings)).toEqual([...TIMELINE_WARNING_CODES]);
    expect(codes(response('SetupResponseDto').twilight!.properties!.warnings)).toEqual([
      ...TWILIGHT_WARNING_CODES,
    ]);
  });

  it("publishes a test frame's warning and note codes as the shared library's lists", () => {
    const codes = (s: Schema | undefined) => s?.items?.properties?.code?.enum;
    const frame = schemas['FrameResponseDto']!.properties!;
    expect(codes(frame.warnings)).toEqual([...FRAME_WARNING_CODES]);
    expect(codes(frame.colour!.properties!.notes)).toEqual([...FRAME_NOTE_CODES]);
    const listed = schemas['FrameListResponseDto']!.properties!.data!.items!.properties!;
    expect(codes(listed.warnings)).toEqual([...FRAME_WARNING_CODES]);
    expect(codes(listed.colour!.properties!.notes)).toEqual([...FRAME_NOTE_CODES]);
  });

  it("publishes the setup's modifier kinds as the shared library's list, in and out", () => {
    const key = (name: string) => schemas[name]!.properties!.key!.properties!.modifier!.enum;
    expect(key('SetupRequestDto')).toEqual([...MODIFIER_NAMES]);
    expect(key('SetupResponseDto')).toEqual([...MODIFIER_NAMES]);
  });
});
