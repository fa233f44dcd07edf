// How stored warnings and notes read back: coded ones as they are, older plain strings (and
// anything with a code the lists do not have) as `unclassified`, the text kept.
import { FRAME_NOTE_CODES, FRAME_WARNING_CODES } from '@lumenwright/shared';
import { readCoded } from './frame.mapper.js';

describe('readCoded', () => {
  it('keeps a listed code and its message', () => {
    expect(
      readCoded({ code: 'patch-clipped', message: 'Part is clipped.' }, FRAME_WARNING_CODES),
    ).toEqual({ code: 'patch-clipped', message: 'Part is clipped.' });
    expect(readCoded({ code: 'tint', message: 'Leans green.' }, FRAME_NOTE_CODES)).toEqual({
      code: 'tint',
      message: 'Leans green.',
    });
  });

  it('reads a plain string (a frame analysed before codes) as unclassified, text kept', () => {
    expect(readCoded('The patch is uneven.', FRAME_WARNING_CODES)).toEqual({
      code: 'unclassified',
      message: 'The patch is uneven.',
    });
  });

  it('reads a code from the other list, or none at all, as unclassified', () => {
    // `tint` is a note code, not a warning code.
    expect(readCoded({ code: 'tint', message: 'x' }, FRAME_WARNING_CODES)).toEqual({
      code: 'unclassified',
      message: 'x',
    });
    expect(readCoded({ message: 'no code' }, FRAME_NOTE_CODES)).toEqual({
      code: 'unclassified',
      message: 'no code',
    });
  });
});
