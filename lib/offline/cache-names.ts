// Names of the service worker's runtime caches, shared by the worker (app/sw.ts) and the page
// code that clears them. Kept free of imports so the worker bundle stays small.

/** Published species and the club's settings: the same for everyone, kept across sign-outs. */
export const WIZARD_DATA_CACHE = 'wizard-data';

/** The wizard page as last rendered for the signed-in member. */
export const ASK_PAGE_CACHE = 'ask-page';

/** The member's own trees. */
export const MEMBER_DATA_CACHE = 'member-data';

/**
 * Every cache that can hold what one signed-in member saw: cleared on sign-out and whenever the
 * browser finds a different member (or nobody) signed in. The `pages*` and `others` caches are
 * Serwist's defaults for visited pages.
 */
export const MEMBER_CACHES = [ASK_PAGE_CACHE, MEMBER_DATA_CACHE, 'pages', 'pages-rsc', 'pages-rsc-prefetch', 'others', 'apis'] as const;

export const OFFLINE_DATA_URL = '/api/wizard/offline-data';
