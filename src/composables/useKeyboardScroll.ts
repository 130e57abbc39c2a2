/**
 * A table wider than the screen scrolls sideways inside itself; with nothing focusable in it (an
 * empty history, a row of plain text) a keyboard could never reach the hidden columns (WCAG 2.1.1).
 * While it overflows, its scroll box becomes a named, focusable region, so Tab lands on it and the
 * arrow keys scroll it; when everything fits it is left out of the Tab order again.
 */
import { onBeforeUnmount, onMounted, onUpdated, useTemplateRef, type ComponentPublicInstance } from 'vue';

/** `refName` is the `ref` on the component's `<a-table>`; `label` names the region ("Print history"). */
export function useKeyboardScroll(refName: string, label: string): void {
  const table = useTemplateRef<ComponentPublicInstance>(refName);
  let observer: ResizeObserver | null = null;
  const root = (): Element | null => (table.value?.$el instanceof Element ? table.value.$el : null);

  function mark(): void {
    for (const box of root()?.querySelectorAll('.ant-table-content') ?? []) {
      const overflows = box.scrollWidth > box.clientWidth + 1;
      for (const [name, value] of [
        ['tabindex', '0'],
        ['role', 'region'],
        ['aria-label', label],
      ]) {
        if (overflows) box.setAttribute(name, value);
        else box.removeAttribute(name);
      }
    }
  }
  onMounted(() => {
    mark();
    const el = root();
    if (el) (observer = new ResizeObserver(mark)).observe(el);
  });
  onUpdated(mark);
  onBeforeUnmount(() => observer?.disconnect());
}
