// Test helper: read a PDF's pages back with pdfjs-dist (npm only, no system tools), as the text a
// reader's viewer would copy and as positioned text items for layout checks.
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';

export interface PdfTextItem {
  str: string;
  x: number;
  /** from the bottom of the page, as PDF coordinates are */
  y: number;
  width: number;
  /** false for rotated text (the DRAFT mark, a vertical axis label) */
  upright: boolean;
}

export interface PdfPage {
  width: number;
  height: number;
  /** the items joined, a space at each line end, whitespace collapsed */
  text: string;
  items: PdfTextItem[];
}

export async function readPdfPages(bytes: Buffer): Promise<PdfPage[]> {
  const task = getDocument({
    data: new Uint8Array(bytes),
    isEvalSupported: false,
    disableFontFace: true,
    useSystemFonts: false,
    verbosity: 0,
  });
  const pdf = await task.promise;
  try {
    const pages: PdfPage[] = [];
    for (let n = 1; n <= pdf.numPages; n += 1) {
      const page = await pdf.getPage(n);
      const viewport = page.getViewport({ scale: 1 });
      const content = await page.getTextContent();
      const items: PdfTextItem[] = [];
      let text = '';
      for (const item of content.items) {
        if (!('str' in item)) continue;
        const [a, b, c, , e, f] = item.transform as number[];
        items.push({
          str: item.str,
          x: e!,
          y: f!,
          width: item.width,
          upright: Math.abs(b!) < 1e-6 && Math.abs(c!) < 1e-6 && a! > 0,
        });
        text += item.str + (item.hasEOL ? ' ' : '');
      }
      pages.push({ width: viewport.width, height: viewport.height, text: text.replace(/\s+/g, ' '), items });
    }
    return pages;
  } finally {
    await pdf.destroy();
  }
}
