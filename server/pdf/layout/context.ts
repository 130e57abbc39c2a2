/**
 * What every output's layout receives: the request (options already merged with their defaults),
 * the font metrics to measure with, and one list that collects warnings without repeats.
 */
import { printOptionSchemas, type PrintOptions, type PrintOutput, type PrintWarning } from '../../../shared/schemas/print.js';
import type { Circuit } from '../../../shared/schemas/schedule.js';
import type { TypeMetrics } from '../model.js';
import type { RenderRequest } from '../types.js';

export class WarningList {
  readonly list: PrintWarning[] = [];
  private readonly seen = new Set<string>();
  add(w: PrintWarning): void {
    const key = `${w.code}\u0000${w.label ?? ''}\u0000${w.message}`;
    if (this.seen.has(key)) return;
    this.seen.add(key);
    this.list.push(w);
  }
  /** The usual warning when a label's text was cut with an ellipsis. */
  cut(label: string, text: string): void {
    this.add({ code: 'text-cut', label, message: `${label}: "${text}" did not fit and was cut short` });
  }
}

export interface LayoutContext<O extends PrintOutput = PrintOutput> {
  req: RenderRequest<O>;
  options: PrintOptions[O];
  tm: TypeMetrics;
  warnings: WarningList;
}

/** Options as given, over the schema's defaults (callers may pass a partial or empty object). */
export function withDefaults<O extends PrintOutput>(output: O, given: Partial<PrintOptions[O]> | undefined): PrintOptions[O] {
  const defaults = printOptionSchemas[output].parse({}) as PrintOptions[O];
  const set = Object.fromEntries(Object.entries(given ?? {}).filter(([, v]) => v !== undefined));
  return { ...defaults, ...set } as PrintOptions[O];
}

/** Whether a circuit is among the ways asked for (`onlyWays` and, for flags, the `ways` option). */
export function wayFilter(onlyWays: number[] | undefined, waysOption?: string): (c: Pick<Circuit, 'way'>) => boolean {
  const sets = [onlyWays ? new Set(onlyWays) : null, waysOption ? new Set(waysOption.split(',').map(Number)) : null].filter(
    (s): s is Set<number> => s !== null,
  );
  return (c) => sets.every((s) => s.has(c.way));
}
