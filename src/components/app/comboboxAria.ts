/**
 * Repairs the ARIA of the combobox input that every ant-design-vue 4 select renders (ours and the
 * library's own, such as a table's page-size picker), so a screen reader and axe-core are told the
 * truth about it. Installed once for the whole document from main.ts; screens write `<a-select
 * aria-label="Way 3 cable type" …>` as the library documents and need nothing else.
 *
 * - `aria-expanded` is left off while the list is closed, but a combobox must always say whether it
 *   is open (ARIA 1.2: a required state). It is set from the select's `ant-select-open` class.
 * - `aria-activedescendant` names an option of a list that is only rendered while open, so while
 *   closed it points at nothing. It is taken off then and put back when the list opens.
 * - A name given to the select (`aria-label`, `aria-labelledby`, `aria-describedby`) lands on its
 *   outer `<div>`, which has no role and never takes focus; it is moved to the input, which does.
 *
 * `aria-owns`/`aria-controls` stay: with `aria-expanded="false"` a list not yet rendered is allowed.
 * Each repair writes only what differs, so the observer settles after one pass.
 */

const SELECT = '.ant-select';
const LIST_LAYER = '.ant-select-dropdown';
const NAMING = ['aria-label', 'aria-labelledby', 'aria-describedby'];
/**
 * Selects the library builds itself, with no way to pass them a name: named here by where they sit.
 * A table's page-size picker shows only "20 / page".
 */
const LIBRARY_SELECT_NAMES: [string, string][] = [['.ant-pagination-options', 'Rows per page']];
/** The last active option of each input, kept while its list is closed. */
const heldActive = new WeakMap<Element, string>();

function setAttribute(el: Element, name: string, value: string | null): void {
  if (value === null) {
    if (el.hasAttribute(name)) el.removeAttribute(name);
  } else if (el.getAttribute(name) !== value) el.setAttribute(name, value);
}

/** Brings one select's input (`root` is its `.ant-select`) in line with the select's state. */
export function repairCombobox(root: Element): void {
  const input = root.querySelector('input[role="combobox"]');
  if (!input) return;
  for (const name of NAMING) {
    const value = root.getAttribute(name);
    if (value === null) continue;
    setAttribute(input, name, value);
    root.removeAttribute(name);
  }
  if (!input.hasAttribute('aria-label') && !input.hasAttribute('aria-labelledby')) {
    const known = LIBRARY_SELECT_NAMES.find(([around]) => root.closest(around));
    if (known) input.setAttribute('aria-label', known[1]);
  }
  const open = root.classList.contains('ant-select-open');
  setAttribute(input, 'aria-expanded', String(open));
  const active = input.getAttribute('aria-activedescendant');
  if (active) heldActive.set(input, active);
  const held = heldActive.get(input) ?? null;
  // Open, the list is drawn within a frame or two: the option named is the one the library last made active.
  setAttribute(input, 'aria-activedescendant', open ? held : null);
}

function selectsTouchedBy(records: MutationRecord[]): Set<Element> {
  const found = new Set<Element>();
  for (const record of records) {
    const target = record.target instanceof Element ? record.target : record.target.parentElement;
    const around = target?.closest(SELECT);
    if (around) found.add(around);
    // An open list's options came or went: its select may point at them now.
    if (target?.closest(LIST_LAYER)) for (const open of document.querySelectorAll(`${SELECT}-open`)) found.add(open);
    for (const node of record.addedNodes) {
      if (!(node instanceof Element)) continue;
      if (node.matches(SELECT)) found.add(node);
      for (const inner of node.querySelectorAll(SELECT)) found.add(inner);
      if (node.matches(LIST_LAYER) || node.querySelector(LIST_LAYER)) for (const open of document.querySelectorAll(`${SELECT}-open`)) found.add(open);
    }
  }
  return found;
}

/**
 * Repairs every select under `root` now and whenever one appears or changes. A list opens in a
 * layer of its own a frame after its select's class changes, so opened selects are looked at again then.
 * Returns a function that stops watching.
 */
export function watchComboboxes(root: Element): () => void {
  for (const select of root.querySelectorAll(SELECT)) repairCombobox(select);
  const observer = new MutationObserver((records) => {
    const touched = selectsTouchedBy(records);
    for (const select of touched) repairCombobox(select);
    if (touched.size) requestAnimationFrame(() => touched.forEach(repairCombobox));
  });
  observer.observe(root, { subtree: true, childList: true, attributes: true, attributeFilter: ['class', 'aria-expanded', 'aria-activedescendant', ...NAMING] });
  return () => observer.disconnect();
}
