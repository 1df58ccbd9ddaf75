// Flow layout for the PDF: a cursor down the page, explicit page breaks, and a table that wraps
// cells and repeats its header row on every page it spans.
import { COLOR, CONTENT_BOTTOM, CONTENT_WIDTH, MARGIN, PAGE } from './pdf-style';
import { drawParagraph, drawTextLine, lineHeight, measureParagraph, wrapText, type Weight } from './pdf-text';

type Doc = PDFKit.PDFDocument;

export class PageFlow {
  y: number = MARGIN.top;
  constructor(readonly doc: Doc) {}

  addPage(): void {
    this.doc.addPage({ size: [PAGE.width, PAGE.height], margins: { top: 0, bottom: 0, left: 0, right: 0 } });
    this.y = MARGIN.top;
  }

  /** Start a new page unless `height` more points fit above the footer. */
  ensureSpace(height: number): void {
    if (this.y + height > CONTENT_BOTTOM) this.addPage();
  }

  /** A section heading with a rule; keeps at least `keepWith` points of content on the same page. */
  heading(text: string, keepWith = 60): void {
    this.ensureSpace(24 + keepWith);
    if (this.y > MARGIN.top) this.y += 10;
    drawTextLine(this.doc, text, MARGIN.left, this.y, { size: 11.5, weight: 700, color: COLOR.accent, tag: 'H2' });
    this.y += 16;
    this.doc
      .save()
      .lineWidth(0.6)
      .strokeColor(COLOR.rule)
      .moveTo(MARGIN.left, this.y)
      .lineTo(MARGIN.left + CONTENT_WIDTH, this.y)
      .stroke()
      .restore();
    this.y += 6;
  }

  /** Body text across the content width. */
  paragraph(text: string, size = 8.5, color: string = COLOR.ink, weight: Weight = 400): void {
    const height = measureParagraph(this.doc, text, CONTENT_WIDTH, { size, weight });
    this.ensureSpace(height);
    this.y += drawParagraph(this.doc, text, MARGIN.left, this.y, CONTENT_WIDTH, { size, color, weight });
    this.y += 3;
  }
}

export interface TableColumn {
  label: string;
  /** relative width; the columns are scaled to fill the content width */
  width: number;
  align?: 'left' | 'right' | 'center';
}

export interface TableCell {
  text: string;
  color?: string;
  weight?: Weight;
}

export interface TableOptions {
  size?: number;
  /** shade every other row */
  zebra?: boolean;
}

const PAD_X = 3;
const PAD_Y = 2.6;

/** Draw a table at the flow's cursor, breaking pages between rows and repeating the header. */
export function drawTable(
  flow: PageFlow,
  columns: TableColumn[],
  rows: (TableCell | string)[][],
  options: TableOptions = {},
): void {
  const { doc } = flow;
  const size = options.size ?? 7.4;
  const headerSize = size - 0.6;
  const total = columns.reduce((a, c) => a + c.width, 0);
  const widths = columns.map((c) => (c.width / total) * CONTENT_WIDTH);
  const lefts = widths.map((_, i) => MARGIN.left + widths.slice(0, i).reduce((a, w) => a + w, 0));

  const headerLines = columns.map((c, i) =>
    wrapText(doc, c.label, widths[i]! - 2 * PAD_X, { size: headerSize, weight: 600 }),
  );
  const headerHeight = Math.max(...headerLines.map((l) => l.length)) * lineHeight(headerSize) + 2 * PAD_Y;

  const drawHeader = () => {
    doc.rect(MARGIN.left, flow.y, CONTENT_WIDTH, headerHeight).fill(COLOR.headerFill);
    headerLines.forEach((lines, i) =>
      lines.forEach((line, k) =>
        drawTextLine(doc, line, lefts[i]! + PAD_X, flow.y + PAD_Y + k * lineHeight(headerSize), {
          size: headerSize,
          weight: 600,
          color: COLOR.ink,
          align: columns[i]!.align ?? 'left',
          width: widths[i]! - 2 * PAD_X,
        }),
      ),
    );
    flow.y += headerHeight;
    doc
      .save()
      .lineWidth(0.6)
      .strokeColor(COLOR.muted)
      .moveTo(MARGIN.left, flow.y)
      .lineTo(MARGIN.left + CONTENT_WIDTH, flow.y)
      .stroke()
      .restore();
  };

  const cells = rows.map((row) => row.map((c) => (typeof c === 'string' ? { text: c } : c)));
  const wrapped = cells.map((row) =>
    row.map((c, i) => wrapText(doc, c.text, widths[i]! - 2 * PAD_X, { size, weight: c.weight ?? 400 })),
  );
  const heights = wrapped.map((row) => Math.max(1, ...row.map((l) => l.length)) * lineHeight(size) + 2 * PAD_Y);

  flow.ensureSpace(headerHeight + (heights[0] ?? 0));
  drawHeader();
  cells.forEach((row, r) => {
    const height = heights[r]!;
    if (flow.y + height > CONTENT_BOTTOM) {
      flow.addPage();
      drawHeader();
    }
    if (options.zebra !== false && r % 2 === 1) doc.rect(MARGIN.left, flow.y, CONTENT_WIDTH, height).fill(COLOR.zebra);
    row.forEach((cell, i) =>
      wrapped[r]![i]!.forEach((line, k) =>
        drawTextLine(doc, line, lefts[i]! + PAD_X, flow.y + PAD_Y + k * lineHeight(size), {
          size,
          weight: cell.weight ?? 400,
          color: cell.color ?? COLOR.ink,
          align: columns[i]!.align ?? 'left',
          width: widths[i]! - 2 * PAD_X,
        }),
      ),
    );
    flow.y += height;
    doc
      .save()
      .lineWidth(0.3)
      .strokeColor(COLOR.rule)
      .moveTo(MARGIN.left, flow.y)
      .lineTo(MARGIN.left + CONTENT_WIDTH, flow.y)
      .stroke()
      .restore();
  });
  flow.y += 6;
}
