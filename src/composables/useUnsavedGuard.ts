/**
 * Keeps unsaved edits from vanishing: asks before leaving the route inside the app and lets
 * the browser ask before closing or reloading the tab. Cleans up when the component goes.
 */
import { onBeforeUnmount, onMounted, type Ref } from 'vue';
import { onBeforeRouteLeave, onBeforeRouteUpdate } from 'vue-router';

const QUESTION = 'This board has changes that are not saved. Leave and lose them?';

/**
 * @param dirty true while there are unsaved edits
 * @param confirmLeave asks the user; defaults to the browser's confirm dialog
 */
export function useUnsavedGuard(dirty: Ref<boolean>, confirmLeave: (question: string) => boolean | Promise<boolean> = (q) => window.confirm(q)) {
  const onBeforeUnload = (event: BeforeUnloadEvent) => {
    if (!dirty.value) return;
    event.preventDefault();
    // Older browsers show the dialog only when returnValue is set.
    event.returnValue = QUESTION;
  };
  onMounted(() => window.addEventListener('beforeunload', onBeforeUnload));
  onBeforeUnmount(() => window.removeEventListener('beforeunload', onBeforeUnload));

  const guard = async () => (dirty.value ? await confirmLeave(QUESTION) : true);
  onBeforeRouteLeave(guard);
  onBeforeRouteUpdate(async (to, from) => (to.params.id === from.params.id ? true : guard()));
  return { question: QUESTION };
}
