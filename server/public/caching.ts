/**
 * What a shared HTTP cache in front of the app may do with the board page: keep a 200 for
 * BOARD_PAGE_FRESH_S and then, while it asks the app again in the background, serve it for up to
 * BOARD_PAGE_STALE_S more. So repeated scans of one tag cost the app at most one request a minute
 * per cache, and any change (a save, a rotated token, a page switched off) is seen by every visitor
 * within BOARD_PAGE_CHANGE_WITHIN_S. When the cache asks again it sends the entity tag, and the app
 * answers 304 while the page is the same, or the new page, or a 404 that is never stored.
 * Everything else under /api (signed-in, errors, limits) is `private, no-store`.
 */

/** Seconds a shared cache may serve a board page without asking the app. // common practice: a minute for a page that changes at a save */
export const BOARD_PAGE_FRESH_S = 60;
/** Seconds more a cache may serve it while it asks the app again (RFC 5861 stale-while-revalidate). */
export const BOARD_PAGE_STALE_S = 60;
/** The stated time: a change to a board page reaches every visitor within this. */
export const BOARD_PAGE_CHANGE_WITHIN_S = BOARD_PAGE_FRESH_S + BOARD_PAGE_STALE_S;

/** For a board page's JSON, its logo and the page's HTML shell: no cookie, nothing private, the same for every visitor. */
export const BOARD_PAGE_CACHE_CONTROL = `public, max-age=${BOARD_PAGE_FRESH_S}, stale-while-revalidate=${BOARD_PAGE_STALE_S}`;

/** For everything else, and for a board page's 404 and 429: no cache keeps it, so switching a page on or a limit's end shows at once. */
export const PRIVATE_CACHE_CONTROL = 'private, no-store';
