/**
 * Page breaking for the chart: a cursor down the page that starts a new page (with the header,
 * and the table's header row when the table is running) when the next block would reach the footer.
 */
import type { Box, Item } from '../../model.js';
import type { LayoutContext } from '../context.js';
import { continuationHeader, firstPageHeader } from './header.js';
import { columnRules, rowItems, type MeasuredRow, type TableStyle } from './table.js';

/** Sizes fixed for the whole chart once the page is known. */
export interface ChartFrame {
  w: number;
  h: number;
  /** Type scale for this page width (1 on A4 portrait). */
  k: number;
  content: Box;
  style: TableStyle;
  widths: number[];
  /** Where the footer begins (mm from the top). */
  bottom: number;
  headerRow: MeasuredRow;
}

export class ChartPager {
  readonly pages: Item[][] = [];
  y = 0;
  private tableTop: number | null = null;

  constructor(
    private readonly ctx: LayoutContext<'chart'>,
    private readonly frame: ChartFrame,
  ) {}

  private get items(): Item[] {
    return this.pages[this.pages.length - 1];
  }

  /** Begin a page: the full header on the first, one line after; then the table header row if asked. */
  newPage(withTable: boolean): void {
    this.endTable();
    const { ctx, frame } = this;
    const header = this.pages.length === 0 ? firstPageHeader(ctx, frame.content, frame.k) : continuationHeader(ctx, frame.content, frame.k);
    this.pages.push([...header.items]);
    this.y = header.bottom;
    if (!withTable) return;
    this.tableTop = this.y;
    this.items.push(...rowItems(frame.headerRow, frame.content.x, this.y, frame.widths, frame.style, false, true));
    this.y += frame.headerRow.heightMm;
  }

  /** One table row, on a new page if it would reach the footer (a row never splits). */
  row(row: MeasuredRow, shade: boolean): void {
    const { frame } = this;
    const pageHasRows = this.tableTop != null && this.y > this.tableTop + frame.headerRow.heightMm + 1e-6;
    if (this.y + row.heightMm > frame.bottom && pageHasRows) this.newPage(true);
    this.items.push(...rowItems(row, frame.content.x, this.y, frame.widths, frame.style, shade));
    this.y += row.heightMm;
  }

  /** A block laid out by `place(y)` (returning its items and bottom), moved to a new page if it overruns. */
  block(place: (y: number) => { items: Item[]; bottom: number }): void {
    let placed = place(this.y);
    if (placed.bottom > this.frame.bottom) {
      this.newPage(false);
      placed = place(this.y);
    }
    this.items.push(...placed.items);
    this.y = placed.bottom;
  }

  /** Close the running table with its column rules. */
  endTable(): void {
    if (this.tableTop == null || this.pages.length === 0) return;
    this.items.push(...columnRules(this.frame.content.x, this.tableTop, this.y, this.frame.widths));
    this.tableTop = null;
  }
}
