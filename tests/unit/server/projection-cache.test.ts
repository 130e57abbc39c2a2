import { describe, expect, it } from 'vitest';
import { createProjectionCache, type PublicBoardBody } from '../../../server/public/service.js';

const body = (bytes: number): PublicBoardBody => ({ page: {} as PublicBoardBody['page'], json: Buffer.alloc(bytes), etag: '"x"' });

describe('the board-page projection cache', () => {
  it('when entries of a big board would pass the byte bound, then the least recently used go and the total stays under it', () => {
    const cache = createProjectionCache(30_000);
    for (let i = 0; i < 10; i++) cache.set(`board-${i}`, body(3_000)); // 9,000 bytes counted each
    expect(cache.calculatedSize).toBeLessThanOrEqual(30_000);
    expect(cache.size).toBe(3);
    expect(cache.has('board-9')).toBe(true);
    expect(cache.has('board-0')).toBe(false);
  });

  it('when one projection is larger than the whole bound, then it is not kept', () => {
    const cache = createProjectionCache(30_000);
    cache.set('huge', body(20_000));
    expect(cache.has('huge')).toBe(false);
  });
});
