/**
 * Taking the editor to the field a finding (or a schema message) concerns: which tab holds
 * the path, and focusing its control once that tab is on screen.
 */
import { nextTick } from 'vue';

export type EditorTab = 'circuits' | 'rows' | 'supply' | 'survey';

/** The editor tab that shows a schedule path such as "circuits.3.measuredZs" or "board.supply.ze". */
export function tabForPath(path: string | undefined): EditorTab {
  if (!path) return 'circuits';
  if (path.startsWith('devices')) return 'rows';
  if (path.startsWith('board')) return 'supply';
  if (path.startsWith('survey')) return 'survey';
  return 'circuits';
}

/** Scrolls to the element marked `data-field="<path>"` and focuses its first control. */
export async function focusField(path: string): Promise<boolean> {
  await nextTick();
  // Tabs render their panes lazily; give the pane one frame to appear.
  await new Promise((resolve) => requestAnimationFrame(resolve));
  const el = document.querySelector<HTMLElement>(`[data-field="${CSS.escape(path)}"]`);
  if (!el) return false;
  el.scrollIntoView({ block: 'center', behavior: 'smooth' });
  el.querySelector<HTMLElement>('input, textarea, [tabindex="0"]')?.focus({ preventScroll: true });
  return true;
}
