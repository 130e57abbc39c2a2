/**
 * The engine's front door: lay out the requested output (pure), then draw it. The print API,
 * the print pack and the handover e-mail all come through `renderOutput`.
 */
import type { PrintOutput } from '../../shared/schemas/print.js';
import { drawLayout } from './draw.js';
import { typeMetrics } from './fonts.js';
import type { LayoutDoc, TypeMetrics } from './model.js';
import type { RenderRequest, RenderResult } from './types.js';
import { WarningList, withDefaults, type LayoutContext } from './layout/context.js';
import { layoutFlags } from './layout/flags.js';
import { layoutWayLabels } from './layout/way-labels.js';
import { layoutChart } from './layout/chart/index.js';
import { layoutNotices } from './layout/notices.js';
import { layoutTag } from './layout/tag.js';
import { layoutCalibration } from './layout/calibration.js';
import { layoutChangeover } from './layout/changeover/index.js';
import { emptyDoc } from './layout/empty.js';
import { trackingMetrics, undrawableWarnings, type ChangedTexts } from './layout/undrawable.js';

type Layouts = { [O in PrintOutput]: (ctx: LayoutContext<O>) => LayoutDoc };
const layouts: Layouts = {
  flags: layoutFlags,
  'way-labels': layoutWayLabels,
  chart: layoutChart,
  notices: layoutNotices,
  tag: layoutTag,
  calibration: layoutCalibration,
  changeover: layoutChangeover,
};

/** The output laid out in mm, without drawing: what tests and previews measure. */
export function layoutOutput<O extends PrintOutput>(given: RenderRequest<O>, tm: TypeMetrics = typeMetrics()): LayoutDoc {
  const req = { ...given, offset: given.offset ?? { xMm: 0, yMm: 0 }, findings: given.findings ?? [] };
  // Every text placed passes through `printable`: the tracker notes what the fonts could not draw, to warn of it.
  const changed: ChangedTexts = new Map();
  const ctx: LayoutContext<O> = { req, options: withDefaults(req.output, req.options), tm: trackingMetrics(tm, changed), warnings: new WarningList() };
  const laid = (layouts[req.output] as (c: LayoutContext<O>) => LayoutDoc)(ctx);
  const layout = laid.pages.length > 0 ? laid : emptyDoc(laid, req.medium, tm);
  layout.warnings.push(...undrawableWarnings(changed, req.schedule, req.contractor));
  return layout;
}

/**
 * Render one output to PDF bytes with its warnings. Throws LayoutError (with a message saying
 * what would work) when the output cannot go on the medium, e.g. a QR code on narrow tape.
 */
export async function renderOutput<O extends PrintOutput>(req: RenderRequest<O>): Promise<RenderResult> {
  const layout = layoutOutput(req);
  const { pdf, imagesLeftOut } = await drawLayout(layout, req.offset ?? { xMm: 0, yMm: 0 });
  // The draw step leaves out an image it cannot decode: say so rather than print a hole silently.
  if (imagesLeftOut > 0) layout.warnings.push({ code: 'logo-left-off', message: 'The contractor logo could not be read and was left off' });
  return { pdf, warnings: layout.warnings, pageCount: layout.pages.length };
}
