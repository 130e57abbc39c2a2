/**
 * Who is signed in, for the guards, the shell and every view that hides what a role cannot do.
 * The server enforces roles on every route; these helpers only keep the UI honest.
 */
import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import type { AcceptInvitationInput } from '../../shared/schemas/members.js';
import type { LoginInput, Me, Role, SignupInput } from '../../shared/schemas/auth.js';
import * as authApi from '../api/auth.js';
import { clearAllDrafts } from './boardDraft.js';

export type SessionStatus = 'idle' | 'loading' | 'ready' | 'error';

export const useSessionStore = defineStore('session', () => {
  const status = ref<SessionStatus>('idle');
  const me = ref<Me | null>(null);
  const error = ref<string | null>(null);
  /** A one-off message for the shell, e.g. why the guard sent the member back to the boards. */
  const notice = ref<string | null>(null);

  const role = computed<Role | null>(() => me.value?.user.role ?? null);
  const signedIn = computed(() => me.value !== null);
  const isOwner = computed(() => role.value === 'owner');
  /** Owners and electricians create, edit and print boards; viewers read and print only. */
  const canEdit = computed(() => role.value === 'owner' || role.value === 'electrician');

  /** True when the member holds one of the roles (no list means any signed-in member). */
  function hasRole(roles?: readonly Role[]): boolean {
    if (!role.value) return false;
    return !roles || roles.length === 0 || roles.includes(role.value);
  }

  let inFlight: Promise<void> | null = null;

  /** Asks the server who is signed in. Concurrent calls share one request. */
  function load(): Promise<void> {
    inFlight ??= (async () => {
      status.value = 'loading';
      error.value = null;
      try {
        me.value = await authApi.fetchMe();
        status.value = 'ready';
      } catch (err) {
        error.value = err instanceof Error ? err.message : String(err);
        status.value = 'error';
      } finally {
        inFlight = null;
      }
    })();
    return inFlight;
  }

  /** Loads once; a failed load is retried on the next navigation. */
  async function ensureLoaded(): Promise<void> {
    if (status.value === 'ready') return;
    await load();
  }

  async function signIn(input: LoginInput): Promise<void> {
    await authApi.signIn(input);
    await load();
  }

  /** Asks for the sign-up link; nothing is signed in until the link is opened. */
  async function signUp(input: SignupInput): Promise<void> {
    await authApi.signUp(input);
  }

  async function confirmSignUp(token: string): Promise<void> {
    await authApi.confirmSignUp(token);
    await load();
  }

  async function acceptInvitation(input: AcceptInvitationInput): Promise<void> {
    await authApi.acceptInvitation(input);
    await load();
  }

  async function signOut(): Promise<void> {
    try {
      await authApi.signOut();
    } finally {
      clearAllDrafts();
      me.value = null;
      status.value = 'ready';
    }
  }

  /**
   * The server answered 401 to a signed-in screen: the session ended elsewhere (signed out,
   * password reset, member disabled). The shell sees `me` go and sends the member to sign in.
   */
  function expire(): void {
    if (me.value) me.value = null;
  }

  /** After the organisation is renamed, the header should show the new name without a reload. */
  function renameOrganisation(name: string): void {
    if (me.value) me.value = { ...me.value, organisation: { ...me.value.organisation, name } };
  }

  return {
    status,
    me,
    error,
    notice,
    role,
    signedIn,
    isOwner,
    canEdit,
    hasRole,
    load,
    ensureLoaded,
    signIn,
    signUp,
    confirmSignUp,
    acceptInvitation,
    signOut,
    expire,
    renameOrganisation,
  };
});
