/**
 * Warnings for characters the fonts cannot draw. Every text a layout places goes through
 * `TypeMetrics.printable` (fit.ts), which puts the substitute □ for what a face lacks; the tracker
 * below notes each text it changed, so no output can print a substitute without saying so. Each
 * warning names the typed field it came from ("Way 3 label"), found among the schedule's printed
 * texts (shared/fonts/printed-text.ts); a text no field accounts for is quoted whole.
 */
import type { PrintWarning } from '../../../shared/schemas/print.js';
import type { Schedule } from '../../../shared/schemas/schedule.js';
import { printedTexts } from '../../../shared/fonts/printed-text.js';
import { charactersMessage, isNotDrawn } from '../../../shared/fonts/undrawable.js';
import type { TypeMetrics } from '../model.js';
import type { Contractor } from '../types.js';
import { cleanText } from './text.js';

/** Laid-out texts the fonts changed, each with the characters that did not survive. */
export type ChangedTexts = Map<string, Set<string>>;

/** The metrics with `printable` noting every text it had to change (cached results included). */
export function trackingMetrics(tm: TypeMetrics, changed: ChangedTexts): TypeMetrics {
  return {
    ...tm,
    printable: (text, face) => {
      const out = tm.printable(text, face);
      if (out !== text) {
        const kept = new Set(Array.from(out));
        const lost = Array.from(text).filter((ch) => !kept.has(ch) && !isNotDrawn(ch));
        if (lost.length) changed.set(text, new Set([...(changed.get(text) ?? []), ...lost]));
      }
      return out;
    },
  };
}

interface Source {
  label: string;
  text: string;
}

function sources(schedule: Schedule, contractor: Contractor): Source[] {
  return [
    ...printedTexts(schedule).map((t) => ({ label: t.label, text: cleanText(t.text) })),
    { label: 'Contractor name', text: cleanText(contractor.name) },
    { label: 'Contractor phone', text: cleanText(contractor.phone) },
    { label: 'Contractor e-mail', text: cleanText(contractor.email) },
  ].filter((s) => s.text);
}

/** Whether the laid-out text holds the typed text, or is a piece of it (a wrapped line, a cell of a table). */
const comesFrom = (laidOut: string, typed: string) => laidOut.includes(typed) || typed.includes(laidOut);

/**
 * One warning per typed field whose characters were lost in the layout, naming the field and the
 * characters; then one per laid-out text that no field accounts for (e.g. an organisation's own wording).
 */
export function undrawableWarnings(changed: ChangedTexts, schedule: Schedule, contractor: Contractor): PrintWarning[] {
  const warnings: PrintWarning[] = [];
  if (changed.size === 0) return warnings; // the usual case: no field needs looking at
  /** Per laid-out text, the lost characters some field's warning already names. */
  const named = new Map<string, Set<string>>();
  for (const s of sources(schedule, contractor)) {
    const lost = new Set<string>();
    for (const [text, chars] of changed) {
      if (!comesFrom(text, s.text)) continue;
      for (const ch of chars) {
        if (!s.text.includes(ch)) continue;
        lost.add(ch);
        named.set(text, (named.get(text) ?? new Set()).add(ch));
      }
    }
    const message = charactersMessage(`${s.label} "${s.text}"`, [...lost]);
    if (message) warnings.push({ code: 'undrawable-characters', label: s.label, message });
  }
  for (const [text, chars] of changed) {
    const message = charactersMessage(
      `"${text}"`,
      [...chars].filter((ch) => !named.get(text)?.has(ch)),
    );
    if (message) warnings.push({ code: 'undrawable-characters', message });
  }
  return warnings;
}
