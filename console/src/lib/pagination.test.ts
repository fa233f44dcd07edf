import { describe, expect, it } from 'vitest';
import {
  currentCursor,
  firstPageParams,
  hasPreviousPage,
  nextPageParams,
  previousPageParams,
} from './pagination';

describe('cursor pagination in the URL', () => {
  it('walks forward three pages and back to the first, keeping other params', () => {
    const page1 = new URLSearchParams('q=harbour');
    expect(currentCursor(page1)).toBeUndefined();
    expect(hasPreviousPage(page1)).toBe(false);

    const page2 = nextPageParams(page1, 'c2');
    expect(currentCursor(page2)).toBe('c2');
    expect(page2.get('q')).toBe('harbour');
    expect(hasPreviousPage(page2)).toBe(true);

    const page3 = nextPageParams(page2, 'c3');
    expect(currentCursor(page3)).toBe('c3');

    const back2 = previousPageParams(page3);
    expect(currentCursor(back2)).toBe('c2');
    expect(back2.get('q')).toBe('harbour');

    const back1 = previousPageParams(back2);
    expect(back1.toString()).toBe('q=harbour');
    expect(hasPreviousPage(back1)).toBe(false);
  });

  it('a shared link with only a cursor goes back to the first page', () => {
    const shared = new URLSearchParams('cursor=c9');
    expect(previousPageParams(shared).toString()).toBe('');
  });

  it('firstPageParams drops the position but keeps filters', () => {
    const deep = nextPageParams(nextPageParams(new URLSearchParams('status=429'), 'a'), 'b');
    expect(firstPageParams(deep).toString()).toBe('status=429');
  });
});
