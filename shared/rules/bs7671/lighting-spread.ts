/**
 * Lighting and the division of the installation (BS 7671 314.1, 314.2): an installation is divided into
 * circuits to minimise inconvenience in the event of a fault and to take account of the failure of a single
 * circuit such as a lighting circuit. An RCD shared by several circuits trips on a fault on any of them, so
 * two arrangements are warned about:
 *
 * - one RCD (shared with at least one other circuit) carries more than half of the board's lighting
 *   circuits: one trip leaves most of the lighting dark (`lighting-behind-one-rcd`);
 * - an area that two or more lighting circuits serve has all of them behind one such RCD: one trip leaves
 *   that area dark (`area-lighting-behind-one-rcd`). Areas are the circuits' recorded `locations`, matched
 *   without regard to case or spaces; an area lit by one circuit alone is dark when that circuit trips
 *   whatever its RCD, so it is not warned about.
 *
 * "More than half" and the area test are our thresholds (common practice), not figures of the standard.
 * RCBOs protect one circuit each, so they never count as shared; only the RCD nearest a circuit is known.
 */
import type { Finding } from '../types.js';
import { rcdNames, wayText } from '../../schedule/derive.js';
import { waysText, type CircuitFacts, type ScheduleView } from './view.js';

const DIVISION_RULE = 'BS 7671 314.1, 314.2';
const ADVICE = 'spread lighting across RCDs or use RCBOs';

/** An RCD and the circuits behind it, lighting and other. */
interface RcdGroup {
  id: string;
  name: string;
  lighting: CircuitFacts[];
  others: number;
}

/** Groups of circuits behind a shared RCD (kind `rcd`, two or more circuits) that carry any lighting. */
function sharedRcdGroups(view: ScheduleView): RcdGroup[] {
  const names = rcdNames(view.schedule);
  const groups = new Map<string, RcdGroup>();
  for (const f of view.circuits) {
    if (f.rcd?.kind !== 'rcd') continue;
    const g = groups.get(f.rcd.id) ?? { id: f.rcd.id, name: names.get(f.rcd.id) ?? 'one RCD', lighting: [], others: 0 };
    if (f.circuit.kind === 'lighting') g.lighting.push(f);
    else g.others++;
    groups.set(f.rcd.id, g);
  }
  return [...groups.values()].filter((g) => g.lighting.length > 0 && g.lighting.length + g.others >= 2);
}

const byWay = (a: CircuitFacts, b: CircuitFacts) => a.circuit.way - b.circuit.way || (a.circuit.phase ?? '').localeCompare(b.circuit.phase ?? '');
const waysOf = (fs: CircuitFacts[]) => [...new Set(fs.map((f) => f.circuit.way))].sort((a, b) => a - b);
const listed = (items: string[]) => (items.length <= 1 ? items.join('') : `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`);
const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;

function finding(code: string, fs: CircuitFacts[], message: string): Finding {
  const sorted = [...fs].sort(byWay);
  return { severity: 'warning', code, rule: DIVISION_RULE, ways: waysOf(sorted), field: `circuits.${sorted[0].index}.deviceId`, message };
}

/** "All 3 lighting circuits (ways 1, 2 and 5)", "3 of 4 lighting circuits (…)", "The only lighting circuit (way 1)". */
function mostLightingFinding(g: RcdGroup, total: number): Finding {
  const ways = waysText([...g.lighting].sort(byWay).map((f) => wayText(f.circuit)));
  const n = g.lighting.length;
  const head =
    n === total
      ? n === 1
        ? `The only lighting circuit (${ways}) is`
        : `All ${n} lighting circuits (${ways}) are`
      : `${n} of ${total} lighting circuits (${ways}) are`;
  const others = g.others ? ` with ${plural(g.others, 'other circuit')}` : '';
  const dark = n === total ? 'all of the lighting' : 'most of the lighting';
  return finding(
    'lighting-behind-one-rcd',
    g.lighting,
    `${head} behind ${g.name}${others}: one trip of ${g.name} leaves ${dark} dark; ${ADVICE} (${DIVISION_RULE})`,
  );
}

/** Each recorded area's lighting circuits, keyed by the area as compared (lower case, single spaces). */
function lightingByArea(lighting: CircuitFacts[]): Map<string, { name: string; circuits: CircuitFacts[] }> {
  const areas = new Map<string, { name: string; circuits: CircuitFacts[] }>();
  for (const f of lighting) {
    for (const location of new Set(f.circuit.locations.map((l) => l.trim().replace(/\s+/g, ' ')))) {
      const key = location.toLowerCase();
      const area = areas.get(key) ?? { name: location, circuits: [] };
      if (!area.circuits.includes(f)) area.circuits.push(f);
      areas.set(key, area);
    }
  }
  return areas;
}

/** Areas lit by two or more circuits, all behind the one shared RCD `g`. */
function darkAreas(g: RcdGroup, areas: ReturnType<typeof lightingByArea>): { names: string[]; circuits: CircuitFacts[] } {
  const names: string[] = [];
  const circuits = new Set<CircuitFacts>();
  for (const area of areas.values()) {
    if (area.circuits.length < 2 || !area.circuits.every((f) => g.lighting.includes(f))) continue;
    names.push(area.name);
    area.circuits.forEach((f) => circuits.add(f));
  }
  return { names, circuits: [...circuits] };
}

function areaFinding(g: RcdGroup, dark: { names: string[]; circuits: CircuitFacts[] }): Finding {
  const ways = waysText(
    [...dark.circuits].sort(byWay).map((f) => wayText(f.circuit)),
    true,
  );
  const areas = listed(dark.names);
  return finding(
    'area-lighting-behind-one-rcd',
    dark.circuits,
    `${ways}, all the lighting of ${areas}, are behind ${g.name}: one trip of ${g.name} leaves ${areas} dark; put one of them on another RCD or use RCBOs (${DIVISION_RULE})`,
  );
}

/** Warns when one RCD's trip would leave most of the lighting, or every light of an area, dark. */
export function checkLightingSpread(view: ScheduleView): Finding[] {
  const lighting = view.circuits.filter((f) => f.circuit.kind === 'lighting');
  if (lighting.length === 0) return [];
  const areas = lightingByArea(lighting);
  const out: Finding[] = [];
  for (const g of sharedRcdGroups(view)) {
    // One finding per RCD: when most of the lighting is behind it, its areas are dark with it and are not listed again.
    if (g.lighting.length * 2 > lighting.length) {
      out.push(mostLightingFinding(g, lighting.length));
      continue;
    }
    const dark = darkAreas(g, areas);
    if (dark.names.length) out.push(areaFinding(g, dark));
  }
  return out;
}
