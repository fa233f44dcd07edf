// Frame responses: one JSON schema each, turned into documented DTO classes.
import { FRAME_NOTE_CODES, FRAME_WARNING_CODES } from '@lumenwright/shared';
import { bool, outNum, str, warningsWith } from '../../compute/schemas/common.js';
import type { JsonSchema } from '../../compute/validation/json-schema.js';
import { schemaDto, type ObjectSchema } from '../../compute/validation/schema-dto.js';

const nNum = (description: string): JsonSchema => ({ type: ['number', 'null'], description });
const nStr = (description: string, values?: string[]): JsonSchema => ({
  type: ['string', 'null'],
  description: values ? `${description} One of ${values.join(', ')}, or null.` : description,
});
const obj = (
  description: string,
  properties: Record<string, JsonSchema>,
  nullable = false,
): JsonSchema => ({
  type: nullable ? ['object', 'null'] : 'object',
  description,
  required: Object.keys(properties),
  properties,
});

const UNCLASSIFIED = 'a frame analysed before warnings had codes; the message is its original text';
const OUT_OF_CCT_RANGE = "past an end of the CCT method's range: cctKelvin is null";

const exifSchema = obj('EXIF exposure settings (null when absent).', {
  exposureTime: nNum('Shutter time, seconds.'),
  fNumber: nNum('Aperture f-number.'),
  iso: nNum('ISO speed.'),
  whiteBalance: nStr('EXIF white-balance mode.', ['auto', 'manual']),
  flashFired: { type: ['boolean', 'null'], description: 'Whether the flash fired.' },
  focalLengthMm: nNum('Focal length, mm.'),
});

const gelSchema = obj(
  'Gel for the light that neutralises the patch at the shot white balance (shared balance solver).',
  {
    requiredMiredShift: outNum('Mired shift needed on the light (+ warms: CTO; - cools: CTB).'),
    gels: {
      type: 'array',
      items: obj('One gel.', {
        name: str('Gel name.'),
        miredShift: outNum('Its mired shift.'),
        lossStops: outNum('Its light loss, stops.'),
      }),
    },
    residualMired: outNum('Achieved minus required shift, mireds.'),
    lossStops: outNum('Total light loss of the stack, stops.'),
  },
  true,
);

const colourSchema = obj('Colour of the patch and the correction.', {
  chromaticity: obj('CIE 1931 xy of the patch (sRGB decoded, linear average).', {
    x: outNum('x'),
    y: outNum('y'),
  }),
  cctKelvin: nNum(
    "Correlated colour temperature, kelvin (Robertson 1968); null outside the method's range, 1667 K to infinite temperature (a warning then says which end).",
  ),
  duv: nNum('Distance from the Planckian locus in CIE 1960 uv (+ greenish).'),
  cctMeaningful: bool("False when |Duv| > 0.05 or outside the method's range (cctKelvin null)."),
  method: str('CCT method.'),
  neutral: obj('The neutral reference: sRGB white (CIE D65).', {
    x: outNum('x'),
    y: outNum('y'),
    cctKelvin: outNum('Its CCT, kelvin.'),
  }),
  miredOffset: nNum('mired(patch) - mired(neutral): + = renders warmer than neutral.'),
  tint: str('Green-magenta lean of the patch.', undefined, { enum: ['green', 'magenta', 'none'] }),
  cameraKelvin: outNum('The shot white balance, kelvin (given, or assumed).'),
  cameraKelvinSource: str('Where cameraKelvin came from.', undefined, {
    enum: ['caller', 'assumed'],
  }),
  lightKelvin: nNum('The light on the patch implied at that white balance, kelvin.'),
  whiteBalance: obj(
    'Camera white balance that renders the patch neutral.',
    {
      kelvin: outNum('Set the camera to this, kelvin.'),
      miredShift: outNum('Change from the shot white balance, mireds.'),
      amberBlueSteps: outNum('Same change in fine-tune steps (+ amber, - blue), ~5 mired each.'),
    },
    true,
  ),
  gel: gelSchema,
  notes: warningsWith(
    FRAME_NOTE_CODES,
    {
      'camera-white-balance-assumed': 'cameraKelvin was not given and is assumed',
      'warmer-than-cct-range': OUT_OF_CCT_RANGE,
      'bluer-than-cct-range': OUT_OF_CCT_RANGE,
      'far-from-locus': '|Duv| is too large for a colour temperature to mean much',
      'fine-tune-beyond-range': 'more amber-blue steps than cameras usually offer',
      'gel-not-solved': 'the gel solver refused the light; the message says why',
      'light-outside-gel-range': 'the light is outside 2500-10000 K: no gel suggestion',
      tint: 'the patch leans green or magenta',
      unclassified: UNCLASSIFIED,
    },
    'Notes on the correction: a stable code and a sentence for people.',
  ),
});

const frameSchema: ObjectSchema = {
  type: 'object',
  properties: {
    id: str('Frame id.', undefined, { format: 'uuid' }),
    fileName: nStr('The uploaded file name, if any.'),
    contentType: str('Type sniffed from the content.', 'image/jpeg', {
      enum: ['image/jpeg', 'image/png'],
    }),
    byteSize: outNum('Size of the original, bytes.'),
    sha256: str('SHA-256 of the original, hex.'),
    width: outNum('Upright width, pixels.'),
    height: outNum('Upright height, pixels.'),
    thumbnailUrl: str('Where to fetch the JPEG thumbnail (same credentials).'),
    exif: exifSchema,
    patch: obj('The measured patch (upright pixel coordinates).', {
      x: outNum('Left, pixels.'),
      y: outNum('Top, pixels.'),
      width: outNum('Width, pixels.'),
      height: outNum('Height, pixels.'),
      source: str('Given by the caller or found automatically.', undefined, {
        enum: ['caller', 'auto'],
      }),
      linearRgb: obj('Mean linear RGB, 0..1.', { r: outNum('r'), g: outNum('g'), b: outNum('b') }),
      luminance: outNum('Mean relative luminance Y (white = 1).'),
      luminanceCv: outNum('Unevenness: coefficient of variation of Y.'),
      clippedFraction: outNum('Share of nearly clipped pixels.'),
    }),
    colour: colourSchema,
    exposure: obj('Exposure estimate.', {
      settingsEv100: nNum('EV100 of the EXIF settings (APEX).'),
      patchLuminance: outNum('Mean linear Y of the patch.'),
      sceneEv100: nNum('Scene EV100, taking the patch as an 18 % grey card.'),
      basis: str('What the estimate assumes.'),
    }),
    warnings: warningsWith(
      FRAME_WARNING_CODES,
      {
        'patch-clipped': 'over 1 % of the patch is nearly clipped',
        'patch-uneven': 'the patch luminance varies by over 10 %',
        'patch-dark': 'the patch luminance is under 1 %',
        'warmer-than-cct-range': OUT_OF_CCT_RANGE,
        'bluer-than-cct-range': OUT_OF_CCT_RANGE,
        unclassified: UNCLASSIFIED,
      },
      'Warnings about the measurement: a stable code and a sentence for people.',
    ),
    createdAt: str('When it was uploaded (ISO 8601).'),
  },
};
frameSchema.required = Object.keys(frameSchema.properties);

export const FrameResponseDto = schemaDto('FrameResponseDto', frameSchema);
export const FrameListResponseDto = schemaDto('FrameListResponseDto', {
  type: 'object',
  required: ['data', 'nextCursor'],
  properties: {
    data: { type: 'array', items: frameSchema },
    nextCursor: nStr('Pass as `cursor` for the next page; null on the last page.'),
  },
});
