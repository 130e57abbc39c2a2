/**
 * The navigation guard: `meta.auth` screens need a signed-in member (else the sign-in page,
 * with a `redirect` back), `meta.roles` screens need one of those roles (else the boards, with
 * a notice saying why). The server refuses the same requests; this keeps people off dead ends.
 */
import type { Pinia } from 'pinia';
import type { LocationQueryValue, RouteLocationNormalized, Router } from 'vue-router';
import type { Role } from '../../shared/schemas/auth.js';

declare module 'vue-router' {
  interface RouteMeta {
    /** The screen needs a signed-in member. */
    auth?: boolean;
    /** Only these roles may open the screen. */
    roles?: Role[];
    /** The screen uses no store, so the store library is not loaded for it (the public board page). */
    storeless?: boolean;
  }
}

/** Sign-in and sign-up make no sense when already signed in. */
const GUEST_ONLY = new Set(['signin', 'signup']);

/** Only same-site paths may be a redirect target (never `//elsewhere` or a full URL). */
export function safeRedirect(value: LocationQueryValue | LocationQueryValue[] | undefined): string | null {
  const path = Array.isArray(value) ? value[0] : value;
  if (typeof path !== 'string' || !path.startsWith('/') || path.startsWith('//') || path.startsWith('/\\')) return null;
  return path;
}

/** The roles of the innermost matched route that names any. */
export function requiredRoles(to: RouteLocationNormalized): Role[] | undefined {
  for (let i = to.matched.length - 1; i >= 0; i--) {
    const roles = to.matched[i].meta.roles;
    if (roles) return roles;
  }
  return undefined;
}

function roleNotice(roles: Role[]): string {
  const names = roles.map((r) => `${r}s`).join(' and ');
  return `That page is for ${names} only, so you are back on the boards.`;
}

export function installRouteGuards(router: Router, loadPinia: () => Promise<Pinia>): void {
  router.beforeEach(async (to) => {
    if (to.meta.storeless) return true;
    const pinia = await loadPinia();
    const needsAuth = to.matched.some((r) => r.meta.auth);
    const guestOnly = typeof to.name === 'string' && GUEST_ONLY.has(to.name);
    if (!needsAuth && !guestOnly) return true;
    // Loaded only here, so public screens (the board page) never download the session code and its schemas.
    const { useSessionStore } = await import('../stores/session.js');
    const session = useSessionStore(pinia);

    await session.ensureLoaded();
    if (guestOnly) {
      return session.signedIn ? (safeRedirect(to.query.redirect) ?? { name: 'boards' }) : true;
    }
    // When the server could not be reached the shell shows the error with a retry.
    if (session.status === 'error') return true;
    if (!session.signedIn) return { name: 'signin', query: { redirect: to.fullPath } };

    const roles = requiredRoles(to);
    if (roles && !session.hasRole(roles)) {
      session.notice = roleNotice(roles);
      return { name: 'boards' };
    }
    return true;
  });
}
