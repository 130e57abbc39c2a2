/**
 * A way-label row's device texts, fitted once for the whole row by `way-device-text.ts` from the room
 * each cell offers (`way-cell.ts`), with the warning that says what the fit did.
 */
import type { LayoutContext } from './context.js';
import { deviceLimits, deviceRoom, type CellText, type DeviceLines } from './way-cell.js';
import { cellList, chooseDeviceFit, deviceFitWarnings, type DeviceCell } from './way-device-text.js';
import type { WayCell } from './way-labels.js';

/** How a warning names a cell: "way 4 L1", "ways 1, 2", or the device's own name. */
function cellWarningName(t: CellText): string {
  if (!/^\d/.test(t.ways)) return t.ways || 'a device';
  return `${t.ways.includes(',') ? 'ways' : 'way'} ${t.ways}`;
}

/**
 * The row's device texts fitted once for the whole row (way-device-text.ts), so every cell sets them
 * at one size in one form, whichever part or changed ways are printed; the warning says what it did.
 */
export function rowDeviceLines(
  row: number,
  cells: WayCell[],
  heightMm: number,
  texts: Map<string, CellText>,
  ctx: LayoutContext<'way-labels'>,
): Map<string, DeviceLines> {
  const strip = `Row ${row} way labels`;
  const fitted: Array<{ id: string; cell: DeviceCell }> = [];
  const leftOff: string[] = [];
  for (const c of cells) {
    const t = texts.get(c.deviceId)!;
    const room = deviceRoom(t, { x: 0, y: 0, w: c.w, h: heightMm }, ctx);
    if (room === 'too-low') leftOff.push(`${cellWarningName(t)} "${t.device}"`);
    else if (room) fitted.push({ id: c.deviceId, cell: { ...room, name: cellWarningName(t), device: t.device } });
  }
  if (leftOff.length) {
    const wider = ctx.req.medium.kind === 'tape' ? 'print on 9 mm tape or wider' : 'choose a taller strip (6 mm or more)';
    ctx.warnings.add({
      code: 'device-text-left-off',
      label: strip,
      message: `${strip}: a ${heightMm} mm high strip holds one line of text, so the device text is left off ${cellList(leftOff)}; ${wider} to show it`,
    });
  }
  const fit = chooseDeviceFit(
    fitted.map((f) => f.cell),
    deviceLimits(ctx),
    ctx.tm,
  );
  for (const w of deviceFitWarnings(
    strip,
    fitted.map((f) => f.cell),
    fit,
  ))
    ctx.warnings.add(w);
  return new Map(fitted.map((f, i) => [f.id, { lines: fit.cells[i].lines, sizePt: fit.sizePt }]));
}
