/**
 * The raster twin of `renderOutput`: the same layout (`layoutOutput`, millimetres) drawn as PNG
 * images in printer pixels for a tape printer's phone app, one image per page (a tape page is one
 * label). Tape labels are turned to run along the image, as the tape leaves the printer: the image
 * is the label's length wide and the tape's width high, and nothing is drawn outside the printable band.
 */
import type { Box, LayoutDoc, LayoutPage } from '../model.js';
import { layoutOutput } from '../render.js';
import { LayoutError, type Medium, type RenderRequest } from '../types.js';
import type { PrintOutput, PrintWarning } from '../../../shared/schemas/print.js';
import { decodes, svgToPng } from './draw.js';
import { pageSvg } from './svg.js';
import { MAX_IMAGE_PIXELS, MAX_IMAGES_PER_REQUEST, MAX_REQUEST_PIXELS, pixelsFor } from './scale.js';

export { pixelsFor, COMMON_DPI, MAX_IMAGE_PIXELS, MAX_IMAGES_PER_REQUEST, MAX_REQUEST_PIXELS } from './scale.js';

export interface RasterImage {
  png: Buffer;
  widthPx: number;
  heightPx: number;
}

export interface RasterResult {
  images: RasterImage[];
  warnings: PrintWarning[];
  /** The layout the images were drawn from (the PDF is drawn from the same one). */
  layout: LayoutDoc;
}

/** The printable band across a tape page (the layout centres it on the tape). */
export function tapeBand(medium: Extract<Medium, { kind: 'tape' }>, page: LayoutPage): Box {
  return { x: (medium.widthMm - medium.printableMm) / 2, y: 0, w: medium.printableMm, h: page.heightMm };
}

/** Refuses, before any drawing, a resolution that would make images too large for one request. */
function checkSize(layout: LayoutDoc, dpi: number): void {
  const sizes = layout.pages.map((p) => pixelsFor(p.widthMm, dpi) * pixelsFor(p.heightMm, dpi));
  const largest = Math.max(0, ...sizes);
  const total = sizes.reduce((a, b) => a + b, 0);
  const mp = (px: number) => `${Math.round(px / 1e6)} MP`;
  if (layout.pages.length > MAX_IMAGES_PER_REQUEST)
    throw new LayoutError(
      `This print would make ${layout.pages.length} images; at most ${MAX_IMAGES_PER_REQUEST} go in one: print fewer ways at a time (the ways option)`,
      'media',
    );
  if (largest > MAX_IMAGE_PIXELS)
    throw new LayoutError(`At ${dpi} dpi one image would be ${mp(largest)}, over ${mp(MAX_IMAGE_PIXELS)}: choose a lower dpi or a smaller medium`, 'dpi');
  if (total > MAX_REQUEST_PIXELS)
    throw new LayoutError(
      `At ${dpi} dpi these images would be ${mp(total)} together, over ${mp(MAX_REQUEST_PIXELS)}: choose a lower dpi or print fewer ways at a time`,
      'dpi',
    );
}

/** Logos that do not decode are taken off the pages (as the PDF leaves them off) and counted. */
async function dropUnreadableImages(layout: LayoutDoc): Promise<number> {
  const verdicts = new Map<Uint8Array, boolean>();
  for (const page of layout.pages) for (const i of page.items) if (i.kind === 'image' && !verdicts.has(i.bytes)) verdicts.set(i.bytes, await decodes(i.bytes));
  for (const page of layout.pages) page.items = page.items.filter((i) => i.kind !== 'image' || verdicts.get(i.bytes));
  return [...verdicts.values()].filter((ok) => !ok).length;
}

async function drawPage(page: LayoutPage, medium: Medium, dpi: number): Promise<RasterImage> {
  const tape = medium.kind === 'tape';
  const { svg, widthPx, heightPx } = pageSvg(page, dpi, tape ? tapeBand(medium, page) : undefined);
  const png = await svgToPng(svg, dpi, tape ? 270 : 0);
  return tape ? { png, widthPx: heightPx, heightPx: widthPx } : { png, widthPx, heightPx };
}

/**
 * Lays out the output and draws each page as a 1-bit PNG at `dpi`. Throws LayoutError as
 * `renderOutput` does, and (field `dpi`) when the images would be too large.
 */
export async function rasterOutput<O extends PrintOutput>(req: RenderRequest<O>, dpi: number): Promise<RasterResult> {
  const layout = layoutOutput(req);
  checkSize(layout, dpi);
  if ((await dropUnreadableImages(layout)) > 0)
    layout.warnings.push({ code: 'logo-left-off', message: 'The contractor logo could not be read and was left off' });
  const images: RasterImage[] = [];
  // One page at a time: libvips already uses the cores, and a long print should not hold every image's buffers at once.
  for (const page of layout.pages) images.push(await drawPage(page, req.medium, dpi));
  return { images, warnings: layout.warnings, layout };
}
