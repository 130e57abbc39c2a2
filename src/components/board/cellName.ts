/**
 * The accessible name of a circuit's control where the column heading is not beside it (a table
 * cell, a phone list row): its way, its phase on a three-phase board, and the column, e.g.
 * "Way 3 cable type" or "Way 4 L2 measured Zs". A screen reader moving down a column then says
 * which circuit each box belongs to.
 */
export function cellName(circuit: { way: number; phase?: string | null }, column: string): string {
  return `Way ${circuit.way}${circuit.phase ? ` ${circuit.phase}` : ''} ${column}`;
}
