/**
 * Cable flags for the junction boxes of a changeover: where an old cable is extended to reach the
 * new board, one flag per planned leg through a box, saying which box it is and both sides of the
 * joint, so the old cable and the new way each read from the flag:
 * "JB1" · "Old Fuse 1 leg 2 → Way 3 Sockets front" · "loft, above the hall · WM-3F7K".
 * The flags themselves are the board flags' piece (`flagPiece`), sized for the old cable.
 */
import type { SurveyWay } from '../../../shared/schemas/survey.js';
import { cablePerimeter, DEFAULT_CSA } from './cable.js';
import { wayFilter, type LayoutContext } from './context.js';
import type { FlagText } from './flags.js';

/** "Old Fuse 1 (red dot) leg 2" (no leg for a one-leg way). */
const oldSide = (w: SurveyWay, leg: number) => `Old ${w.reference}${w.legs > 1 || leg > 1 ? ` leg ${leg}` : ''}`;

/**
 * Every planned leg through a junction box, in the survey's order (old way, new way, leg). The
 * `ways` option and "changed since" pick by the new way's number; `legs` and `bothEnds` do not
 * apply (a junction box flag marks one joint, not a cable end).
 */
export function junctionBoxFlagTexts(ctx: LayoutContext<'flags'>): FlagText[] {
  const survey = ctx.req.schedule.survey;
  if (!survey) return [];
  const wanted = wayFilter(ctx.req.onlyWays, ctx.options.ways);
  const boxes = new Map(survey.junctionBoxes.map((b) => [b.id, b]));
  const flags: FlagText[] = [];
  for (const w of survey.ways) {
    if (w.action === 'retire' || w.action === 'spare') continue;
    for (const t of w.targets.filter(wanted)) {
      for (const leg of t.legs) {
        const box = leg.junctionBoxId != null ? boxes.get(leg.junctionBoxId) : undefined;
        if (leg.junctionBoxId != null && !box) {
          ctx.warnings.add({
            code: 'junction-box-unknown',
            label: `Old ${w.reference}`,
            message: `${oldSide(w, leg.leg)}: junction box "${leg.junctionBoxId}" is not in the survey's list, so no flag is printed for it`,
          });
        }
        if (!box) continue;
        const wrap = cablePerimeter(w.cable);
        if (wrap.basis === 'assumed') {
          ctx.warnings.add({
            code: 'cable-size-assumed',
            label: `${box.name} flag`,
            message: `${oldSide(w, leg.leg)}: no cable size recorded, so the flag is sized for ${DEFAULT_CSA} mm² twin and earth`,
          });
        }
        flags.push({
          name: `${box.name} flag (${oldSide(w, leg.leg)})`,
          way: box.name,
          label: `${oldSide(w, leg.leg)} → Way ${t.way}${t.phase ? ` ${t.phase}` : ''} ${t.label}`,
          info: [box.location, ctx.req.board.code].filter(Boolean).join(' · '),
          wrapMm: wrap.perimeterMm + ctx.options.overlapMm,
        });
      }
    }
  }
  return flags;
}
