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

/** Lists that build only the rows on screen (the circuit table) bring a path's row into being when asked. */
type FieldRevealer = (path: string) => Promise<void>;
const revealers = new Set<FieldRevealer>();

/** Registers a list's revealer for as long as it is on screen; call the returned function on unmount. */
export function addFieldRevealer(reveal: FieldRevealer): () => void {
  revealers.add(reveal);
  return () => revealers.delete(reveal);
}

const frame = () => new Promise((resolve) => requestAnimationFrame(resolve));
const fieldElement = (path: string) => document.querySelector<HTMLElement>(`[data-field="${CSS.escape(path)}"]`);

/** Scrolls to the element marked `data-field="<path>"` and focuses its first control. */
export async function focusField(path: string): Promise<boolean> {
  await nextTick();
  // Tabs render their panes lazily; give the pane one frame to appear.
  await frame();
  if (!fieldElement(path)) for (const reveal of revealers) await reveal(path);
  const el = fieldElement(path);
  if (!el) return false;
  el.scrollIntoView({ block: 'center', behavior: 'smooth' });
  el.querySelector<HTMLElement>('input, textarea, [tabindex="0"]')?.focus({ preventScroll: true });
  return true;
}
