/**
 * The print engine: pure layout in millimetres, then a thin pdf-lib draw step.
 * `renderOutput(req)` gives the PDF; `resolveMedium(id, sheetLayouts)` turns `?media=` into sizes.
 */
export { renderOutput, layoutOutput } from './render.js';
export { resolveMedium, defaultMediumFor, builtInMediaIds, TAPE_BANDS, ISO_216, type SheetLayouts, type TapeSettings } from './media.js';
export { LayoutError, type RenderRequest, type RenderResult, type Medium, type BoardMeta, type Contractor } from './types.js';
export { qrMinSideMm, QR_MIN_MODULE_MM } from './qr.js';
