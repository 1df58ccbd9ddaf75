// Text for the PDF: the Inter font embedded from @fontsource/inter. The package splits Inter into
// subsets (the Latin file has µ ² ± ° – but no ε σ ν; a name like Łukasz needs latin-ext), so
// each run of text goes to the subset that holds it. A few drawing primitives place single lines
// exactly, so layout never depends on pdfkit's automatic page breaks.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { decodeWoff } from './woff';

export type Weight = 400 | 600 | 700;
/** In lookup order: the first subset that covers a character draws it. */
const SUBSETS = ['latin', 'latin-ext', 'greek', 'greek-ext', 'cyrillic', 'cyrillic-ext', 'vietnamese'] as const;
export type Subset = (typeof SUBSETS)[number];

/**
 * Characters that no Inter subset in @fontsource/inter carries (checked glyph by glyph):
 * written as ASCII instead of a blank box.
 */
const SUBSTITUTES: Record<string, string> = {
  '≤': '<=',
  '≥': '>=',
  '√': 'sqrt',
  '→': '->',
  '≈': '~',
  '\u2009': ' ',
};

interface FontFiles {
  dir: string;
  ranges: Record<Subset, [number, number][]>;
}

let fontFiles: FontFiles | null = null;

/** Find the font package from this module, so the built server resolves it like the dev server. */
function locateFontFiles(): FontFiles {
  if (fontFiles) return fontFiles;
  const require = createRequire(import.meta.url);
  const root = path.dirname(require.resolve('@fontsource/inter/package.json'));
  // unicode.json is the package's own statement of which code points each subset file covers.
  const unicode = JSON.parse(readFileSync(path.join(root, 'unicode.json'), 'utf8')) as Record<string, string>;
  const parse = (spec: string | undefined, subset: string): [number, number][] => {
    if (!spec) throw new Error(`@fontsource/inter/unicode.json has no '${subset}' subset`);
    return spec.split(',').map((part) => {
      const [lo, hi] = part.trim().replace(/^U\+/i, '').split('-');
      return [parseInt(lo!, 16), parseInt(hi ?? lo!, 16)];
    });
  };
  const ranges = Object.fromEntries(SUBSETS.map((s) => [s, parse(unicode[s], s)])) as FontFiles['ranges'];
  fontFiles = { dir: path.join(root, 'files'), ranges };
  return fontFiles;
}

/** Absolute path of one Inter file (WOFF 1.0; pdfkit embeds it as TrueType). */
export function interFontPath(subset: Subset, weight: Weight): string {
  return path.join(locateFontFiles().dir, `inter-${subset}-${weight}-normal.woff`);
}

const decodedFonts = new Map<string, Buffer>();

/** The face as plain TrueType, decoded once per process (see woff.ts for why). */
export function loadInterFont(subset: Subset, weight: Weight): Buffer {
  const file = interFontPath(subset, weight);
  let font = decodedFonts.get(file);
  if (!font) {
    font = decodeWoff(readFileSync(file));
    decodedFonts.set(file, font);
  }
  return font;
}

function fontName(subset: Subset, weight: Weight): string {
  return `Inter-${subset}-${weight}`;
}

const registered = new WeakMap<PDFKit.PDFDocument, Set<string>>();

/** Select a face, registering it on this document the first time (only used faces are embedded). */
function useFont(doc: PDFKit.PDFDocument, subset: Subset, weight: Weight, size: number): void {
  const name = fontName(subset, weight);
  let names = registered.get(doc);
  if (!names) registered.set(doc, (names = new Set()));
  if (!names.has(name)) {
    doc.registerFont(name, loadInterFont(subset, weight));
    names.add(name);
  }
  doc.font(name).fontSize(size);
}

function subsetOf(codePoint: number): Subset | null {
  const { ranges } = locateFontFiles();
  for (const subset of SUBSETS)
    if (ranges[subset].some(([lo, hi]) => codePoint >= lo && codePoint <= hi)) return subset;
  return null;
}

export interface TextRun {
  subset: Subset;
  text: string;
}

/** Split text into runs by the Inter subset that holds each character (after substitutions). */
export function splitTextRuns(text: string): TextRun[] {
  const runs: TextRun[] = [];
  for (const raw of text.normalize('NFC')) {
    const chars = SUBSTITUTES[raw] ?? raw;
    for (const ch of chars) {
      const covering = subsetOf(ch.codePointAt(0)!);
      // Outside every subset (CJK, emoji): '?' (Inter has no U+FFFD glyph despite its range list).
      const subset = covering ?? 'latin';
      const shown = covering ? ch : '?';
      const last = runs[runs.length - 1];
      if (last && last.subset === subset) last.text += shown;
      else runs.push({ subset, text: shown });
    }
  }
  return runs;
}

export interface TextStyle {
  size: number;
  weight?: Weight;
  color?: string;
}

type Doc = PDFKit.PDFDocument;

/** Width in points of text set in one style. */
export function measureText(doc: Doc, text: string, style: TextStyle): number {
  let width = 0;
  for (const run of splitTextRuns(text)) {
    useFont(doc, run.subset, style.weight ?? 400, style.size);
    width += doc.widthOfString(run.text);
  }
  return width;
}

export interface PlaceOptions extends TextStyle {
  align?: 'left' | 'right' | 'center';
  /** box width for right or centre alignment */
  width?: number;
}

/** Draw one line of text with its top at y; never wraps and never adds a page. */
export function drawTextLine(doc: Doc, text: string, x: number, y: number, options: PlaceOptions): number {
  const width = measureText(doc, text, options);
  let left = x;
  if (options.align === 'right' && options.width !== undefined) left = x + options.width - width;
  if (options.align === 'center' && options.width !== undefined) left = x + (options.width - width) / 2;
  doc.fillColor(options.color ?? '#1a1f2b');
  for (const run of splitTextRuns(text)) {
    useFont(doc, run.subset, options.weight ?? 400, options.size);
    doc.text(run.text, left, y, { lineBreak: false });
    left += doc.widthOfString(run.text);
  }
  return width;
}

/** Greedy word wrap to a width; a word longer than the line (a sha256) is broken by character. */
export function wrapText(doc: Doc, text: string, width: number, style: TextStyle): string[] {
  const lines: string[] = [];
  for (const paragraph of text.split('\n')) {
    let line = '';
    for (const word of paragraph.split(/ +/)) {
      const candidate = line ? `${line} ${word}` : word;
      if (measureText(doc, candidate, style) <= width) {
        line = candidate;
        continue;
      }
      if (line) lines.push(line);
      line = '';
      let rest = word;
      while (measureText(doc, rest, style) > width) {
        let cut = rest.length - 1;
        while (cut > 1 && measureText(doc, rest.slice(0, cut), style) > width) cut -= 1;
        lines.push(rest.slice(0, cut));
        rest = rest.slice(cut);
      }
      line = rest;
    }
    lines.push(line);
  }
  return lines;
}

/** Line advance for a size: Inter reads well at 1.3× its size in small print. */
export function lineHeight(size: number): number {
  return size * 1.3;
}

/** Draw wrapped text with its top at y; returns the height used. */
export function drawParagraph(
  doc: Doc,
  text: string,
  x: number,
  y: number,
  width: number,
  options: PlaceOptions,
): number {
  const lines = wrapText(doc, text, width, options);
  lines.forEach((line, i) => drawTextLine(doc, line, x, y + i * lineHeight(options.size), { ...options, width }));
  return lines.length * lineHeight(options.size);
}

/** Height that drawParagraph would use. */
export function measureParagraph(doc: Doc, text: string, width: number, style: TextStyle): number {
  return wrapText(doc, text, width, style).length * lineHeight(style.size);
}
