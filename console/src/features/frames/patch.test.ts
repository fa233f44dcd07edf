import { describe, expect, it } from 'vitest';
import { checkFile, toDisplayRect, toImageRect } from './patch';

describe('patch rectangle from a drag on the preview', () => {
  const displayed = { width: 400, height: 300 };
  const natural = { width: 4000, height: 3000 };

  it('scales display pixels to image pixels whichever corner comes first', () => {
    const rect = { x: 1000, y: 500, width: 500, height: 400 };
    expect(toImageRect({ x: 100, y: 50 }, { x: 150, y: 90 }, displayed, natural)).toEqual(rect);
    expect(toImageRect({ x: 150, y: 90 }, { x: 100, y: 50 }, displayed, natural)).toEqual(rect);
  });

  it('clamps to the image and never returns an empty rectangle', () => {
    expect(toImageRect({ x: 390, y: 290 }, { x: 500, y: 400 }, displayed, natural)).toEqual({
      x: 3900,
      y: 2900,
      width: 100,
      height: 100,
    });
    expect(toImageRect({ x: 10, y: 10 }, { x: 10, y: 10 }, displayed, natural)).toEqual({
      x: 100,
      y: 100,
      width: 1,
      height: 1,
    });
    expect(toImageRect({ x: -20, y: -5 }, { x: 5, y: 5 }, displayed, natural)).toMatchObject({
      x: 0,
      y: 0,
    });
  });

  it('maps the rectangle back for the overlay', () => {
    expect(toDisplayRect({ x: 1000, y: 500, width: 500, height: 400 }, displayed, natural)).toEqual(
      {
        x: 100,
        y: 50,
        width: 50,
        height: 40,
      },
    );
  });

  it('checks type and size before uploading', () => {
    expect(checkFile({ type: 'image/jpeg', size: 1000 })).toBeNull();
    expect(checkFile({ type: 'image/gif', size: 1000 })).toBe('Choose a JPEG or PNG file.');
    expect(checkFile({ type: 'image/png', size: 25 * 1024 * 1024 + 1 })).toBe(
      'The file is over 25 MB.',
    );
  });
});
