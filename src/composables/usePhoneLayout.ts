/**
 * Whether the screen is phone-narrow, for the few places that show a different layout there
 * rather than squeezing the laptop one (the circuits as a list, Save in a bar at the bottom).
 * Follows the window as it is resized or turned; stops listening with the component.
 */
import { getCurrentScope, onScopeDispose, ref, type Ref } from 'vue';

/** Widest screen (CSS px) laid out as a phone: a phone turned sideways still is one, a tablet is not. */
export const PHONE_MAX_WIDTH = 720;

export function usePhoneLayout(): { isPhone: Ref<boolean> } {
  const query = window.matchMedia(`(max-width: ${PHONE_MAX_WIDTH}px)`);
  const isPhone = ref(query.matches);
  const update = (event: MediaQueryListEvent) => {
    isPhone.value = event.matches;
  };
  query.addEventListener('change', update);
  if (getCurrentScope()) onScopeDispose(() => query.removeEventListener('change', update));
  return { isPhone };
}
