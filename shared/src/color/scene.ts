import chroma from 'chroma-js';
import { mired } from './mired.js';
import { clamp, round } from '../units/math.js';

/**
 * How other light sources in the frame render under the camera's white balance, for display.
 * The offset is mired(source) - mired(camera WB): + renders warmer (orange), - cooler (blue).
 * Swatch colours come from chroma-js's colour-temperature curve, which is a curve fit for
 * display only (not colorimetry): a source matching the WB is drawn as 6500 K (near-white in
 * sRGB) and others are shifted by their mired offset from there.
 */

/** Typical source colour temperatures, kelvin. Common practice, no source (unless noted). */
export const SCENE_SOURCES = {
  blueHourSky: 12000, // twilight sky > 9000 K
  tungstenWindow: 2800,
  sodiumStreetLight: 2050, // high-pressure sodium ~1950-2100 K
  ledStreetLight: 4000, // from memory; many newer fittings 3000 K
  warmLed: 2700, // household LED, nominal 2700 K class (ANSI C78.377: 2725 ± 145 K)
} as const;

export interface SceneSwatch {
  id: string;
  label: string;
  kelvin: number;
  /** mired(source) - mired(camera WB): + warmer than neutral. */
  miredOffset: number;
  /** Display colour, sRGB hex. */
  hex: string;
  rendersAs: 'much warmer' | 'warmer' | 'neutral' | 'cooler' | 'much cooler';
}

const NEUTRAL_DISPLAY_K = 6500;

function rendersAs(offset: number): SceneSwatch['rendersAs'] {
  if (offset > 100) return 'much warmer';
  if (offset > 20) return 'warmer';
  if (offset < -100) return 'much cooler';
  if (offset < -20) return 'cooler';
  return 'neutral';
}

/** One swatch for a source of `kelvin` under a camera WB of `cameraKelvin`. */
export function sceneSwatch(
  id: string,
  label: string,
  kelvin: number,
  cameraKelvin: number,
): SceneSwatch {
  const offset = mired(kelvin) - mired(cameraKelvin);
  const displayMired = clamp(mired(NEUTRAL_DISPLAY_K) + offset, 1e6 / 40000, 1e6 / 1000);
  return {
    id,
    label,
    kelvin: Math.round(kelvin),
    miredOffset: round(offset, 1),
    hex: chroma.temperature(1e6 / displayMired).hex(),
    rendersAs: rendersAs(offset),
  };
}

/** The standard dusk scene: sky, windows, street lights, and the flash as given. */
export function duskScene(
  cameraKelvin: number,
  keyKelvin: number,
  rimKelvin: number,
  bareFlashKelvin: number,
): SceneSwatch[] {
  const s = SCENE_SOURCES;
  return [
    sceneSwatch('sky-blue-hour', 'Sky at blue hour', s.blueHourSky, cameraKelvin),
    sceneSwatch('tungsten-window', 'Tungsten-lit windows', s.tungstenWindow, cameraKelvin),
    sceneSwatch('sodium-street-light', 'Sodium street lights', s.sodiumStreetLight, cameraKelvin),
    sceneSwatch('led-street-light', 'LED street lights', s.ledStreetLight, cameraKelvin),
    sceneSwatch('key-light', 'Key light (as gelled)', keyKelvin, cameraKelvin),
    sceneSwatch('rim-light', 'Rim light (as gelled)', rimKelvin, cameraKelvin),
    sceneSwatch('rim-light-bare', 'Rim light left bare', bareFlashKelvin, cameraKelvin),
  ];
}
