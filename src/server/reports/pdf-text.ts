// Text for the PDF: the Inter font embedded from @fontsource/inter. The package splits Inter into
// subsets (the Latin file has µ ² ± ° – but no ε σ ν; a name like Łukasz needs latin-ext), so
// each run of text goes to the subset that holds it. No Inter subset has ≤ ≥ √ → ≈: those come
// from Noto Sans Math (@fontsource/noto-sans-math, regular weight only), embedded the same way. A few drawing primitives place single lines
// exactly, so layout never depends on pdfkit's automatic page breaks.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { decodeWoff } from './woff';

export type Weight = 400 | 600 | 700;
/** In lookup order: the first subset that covers a character draws it. */
const SUBSETS = ['latin', 'latin-ext', 'greek', 'greek-ext', 'cyrillic', 'cyrillic-ext', 'vietnamese'] as const;
/** An Inter subset, or the math face for the symbols Inter lacks. */
export type Subset = (typeof SUBSETS)[number] | 'math';

/** Symbols no Inter subset carries (checked glyph by glyph), drawn from Noto Sans Math. */
const MATH_CHARS = new Set(['≤', '≥', '√', '→', '≈', '∓', '≠']);

/** Characters written otherwise: a thin space as a space. */
const SUBSTITUTES: Record<string, string> = {
  '\u2009': ' ',
};

interface FontFiles {
  dir: string;
  ranges: Record<(typeof SUBSETS)[number], [number, number][]>;
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

let mathDir: string | null = null;

/** Absolute path of one font file (WOFF 1.0; pdfkit embeds it as TrueType). */
export function interFontPath(subset: Subset, weight: Weight): string {
  if (subset === 'math') {
    if (!mathDir) {
      const require = createRequire(import.meta.url);
      mathDir = path.join(path.dirname(require.resolve('@fontsource/noto-sans-math/package.json')), 'files');
    }
    // one weight only: a bold ≤ is drawn regular, which reads the same at report sizes
    return path.join(mathDir, 'noto-sans-math-latin-400-normal.woff');
  }
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
  return subset === 'math' ? 'NotoSansMath-400' : `Inter-${subset}-${weight}`;
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
  if (MATH_CHARS.has(String.fromCodePoint(codePoint))) return 'math';
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
  /** structure type for a tagged PDF (default P) */
  tag?: string;
}

/**
 * Structure tags, so a screen reader reads the report in order (PDF/UA-style tagging): every
 * paragraph, heading and table cell is one element under a Document root; a figure is one
 * Figure with its alternative text; running headers, footers and the DRAFT mark are artifacts.
 */
type TagMode = 'tag' | 'inside' | 'artifact';
const tagging = new WeakMap<Doc, { root: PDFKit.PDFStructureElement; mode: TagMode }>();

/** Start the document's structure tree (the document must be created with `tagged: true`). */
export function beginTagging(doc: Doc): void {
  const root = doc.struct('Document');
  doc.addStructure(root);
  tagging.set(doc, { root, mode: 'tag' });
}

/** Close the structure tree before `doc.end()`. */
export function endTagging(doc: Doc): void {
  tagging.get(doc)?.root.end();
}

/** Draw as one structure element (`P`, `H1`, `H2`, `Figure`…); nested calls join the outer one. */
export function tagged(doc: Doc, type: string, draw: () => void, options: { alt?: string } = {}): void {
  const t = tagging.get(doc);
  if (!t || t.mode !== 'tag') {
    draw();
    return;
  }
  const element = doc.struct(type, options.alt ? { alt: options.alt } : {});
  t.root.add(element);
  element.add(doc.markStructureContent(type));
  t.mode = 'inside';
  try {
    draw();
  } finally {
    t.mode = 'tag';
    doc.endMarkedContent();
    element.end();
  }
}

/** Draw page furniture (running header, footer, DRAFT mark) as an artifact a reader skips. */
export function asArtifact(doc: Doc, draw: () => void): void {
  const t = tagging.get(doc);
  if (!t) {
    draw();
    return;
  }
  const before = t.mode;
  t.mode = 'artifact';
  doc.markContent('Artifact', { type: 'Pagination' });
  try {
    draw();
  } finally {
    doc.endMarkedContent();
    t.mode = before;
  }
}

/** Draw one line of text with its top at y; never wraps and never adds a page. */
export function drawTextLine(doc: Doc, text: string, x: number, y: number, options: PlaceOptions): number {
  let width = 0;
  tagged(doc, options.tag ?? 'P', () => {
    width = drawTextRuns(doc, text, x, y, options);
  });
  return width;
}

function drawTextRuns(doc: Doc, text: string, x: number, y: number, options: PlaceOptions): number {
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
  tagged(doc, options.tag ?? 'P', () =>
    lines.forEach((line, i) => drawTextLine(doc, line, x, y + i * lineHeight(options.size), { ...options, width })),
  );
  return lines.length * lineHeight(options.size);
}

/** Height that drawParagraph would use. */
export function measureParagraph(doc: Doc, text: string, width: number, style: TextStyle): number {
  return wrapText(doc, text, width, style).length * lineHeight(style.size);
}
