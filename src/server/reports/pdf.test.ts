import { createRequire } from 'node:module';
import { beforeAll, describe, expect, it } from 'vitest';
import type { StoredGauge } from '../../lib/reduction/compat';
import { REPORT_CAUTION } from './format';
import { renderReportPdf } from './pdf';
import { MARGIN } from './pdf-style';
import { interFontPath, splitTextRuns } from './pdf-text';
import {
  buildReleasedReportInput,
  buildSiReportInput,
  buildUsReportInput,
  engine2Input,
} from './testing/report-fixture';
import { readPdfPages, type PdfPage } from './testing/read-pdf';

const squash = (s: string) => s.replace(/\s+/g, '');
/** pdf.js hands back µ (micro sign) as its compatibility form μ (Greek mu): compare in NFKC. */
const nfkc = (s: string) => s.normalize('NFKC');

describe('renderReportPdf (SI, draft)', () => {
  const input = buildSiReportInput();
  let bytes: Buffer;
  let pages: PdfPage[];

  beforeAll(async () => {
    bytes = await renderReportPdf(input, { compress: false });
    pages = await readPdfPages(bytes);
  }, 60_000);

  it('is a PDF with A4 portrait pages', () => {
    expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(pages.length).toBeGreaterThanOrEqual(3);
    for (const p of pages) {
      expect(p.width).toBeCloseTo(595.28, 1);
      expect(p.height).toBeCloseTo(841.89, 1);
    }
  });

  it('embeds Inter as TrueType (Latin and Greek subsets), not a standard font', () => {
    const text = bytes.toString('latin1');
    expect(text).toMatch(/\/FontFile2 \d+ 0 R/);
    expect(text).toMatch(/\/BaseFont \/[A-Z]{6}\+Inter-Regular/);
    expect(text).toMatch(/\/BaseFont \/[A-Z]{6}\+Inter-Bold/);
    expect(text).not.toMatch(/\/BaseFont \/Helvetica/);
  });

  it('numbers every page as "Page n of N" with N the real page count', () => {
    pages.forEach((p, i) => expect(p.text).toContain(`Page ${i + 1} of ${pages.length}`));
  });

  it('puts DRAFT and the caution on every page', () => {
    for (const p of pages) {
      expect(p.text).toContain('DRAFT');
      expect(squash(p.text)).toContain(squash(REPORT_CAUTION));
    }
  });

  it('is a tagged PDF with language, title and a structure tree a screen reader can follow', () => {
    const raw = bytes.toString('latin1');
    expect(raw).toMatch(/\/MarkInfo \d+ 0 R/);
    expect(raw).toMatch(/\/Marked true/);
    expect(raw).toMatch(/\/StructTreeRoot \d+ 0 R/);
    expect(raw).toMatch(/\/Lang \(en-GB\)/);
    expect(raw).toMatch(/\/DisplayDocTitle true/);
    expect(raw).toMatch(/\/S \/Document/);
    expect(raw).toMatch(/\/S \/H1/);
    expect(raw).toMatch(/\/S \/H2/);
    expect(raw).toMatch(/\/S \/Figure[\s\S]{0,300}\/Alt [(<]/);
    expect(raw).toMatch(/\/Artifact <<\s*\/Type \/Pagination\s*>> BDC/);
    expect(raw).toMatch(/\/P <<\s*\/MCID \d+\s*>> BDC/);
  });

  it('names the verdict as the strain comparison and says it is not acceptance of the hydrotest', () => {
    const all = squash(pages.map((p) => p.text).join(' '));
    expect(all).toContain(squash('STRAIN COMPARISON VERDICT'));
    expect(all).toContain(squash('It is not acceptance of the hydrostatic test'));
    expect(all).toContain(squash('Follow the written test procedure'));
    expect(all).not.toContain(squash('has no disposition yet'));
  });

  it('has extractable text: title, verdict, every gauge id, units with µ and ε', () => {
    const all = pages.map((p) => p.text).join(' ');
    expect(all).toContain('Hydrotest strain report');
    expect(all).toContain(input.test.name);
    expect(all).toContain('CONFORMS');
    for (const g of input.result.gauges) expect(all).toContain(g.id);
    expect(nfkc(all)).toContain(nfkc('µε/MPa'));
    expect(all).toContain('σh');
    expect(all).toContain("Poisson's ratio ν");
    expect(all).toContain(input.logs[0]!.sha256.slice(0, 24));
    expect(all).toContain('Engineering review');
    expect(all).toContain('Ines Okafor');
    expect(all).toContain('#34 (this report)');
  });

  it('prints the test conduct and the statement each signer signed', () => {
    const all = squash(pages.map((p) => p.text).join(' '));
    expect(all).toContain(squash('Test conduct'));
    expect(all).toContain(squash('WP-HT-031 rev B'));
    expect(all).toContain(squash('R. Adeyemi, authorised inspector'));
    expect(all).toContain(squash('14 °C'));
    expect(all).toContain(squash(`Engineering review signed by Ines Okafor: ${input.signatures[0]!.statement}`));
  });

  it('lists every disposition reason in full', () => {
    const all = squash(pages.map((p) => p.text).join(' '));
    for (const d of Object.values(input.dispositions)) expect(all).toContain(squash(d.reason));
  });

  it('draws one titled figure per gauge after the tables', () => {
    const figurePages = pages.filter((p) => p.text.includes('Strain versus pressure'));
    expect(figurePages.length).toBeGreaterThanOrEqual(1);
    const figureText = figurePages.map((p) => p.text).join(' ');
    for (const g of input.result.gauges) expect(figureText).toContain(`${g.channel} · ${g.angleDeg}° from axis`);
    expect(figureText).toContain('Pressure (MPa)');
    expect(figureText).toContain('loading hold');
    expect(figureText).toContain('unloading hold');
    expect(figureText).toContain('±10 % band');
  });

  it('keeps every upright line of text inside the page margins', () => {
    for (const [i, p] of pages.entries()) {
      for (const item of p.items.filter((t) => t.upright && t.str.trim() !== '')) {
        expect(item.x, `page ${i + 1}: '${item.str}'`).toBeGreaterThanOrEqual(MARGIN.left - 1);
        expect(item.x + item.width, `page ${i + 1}: '${item.str}'`).toBeLessThanOrEqual(p.width - MARGIN.right + 1);
        expect(item.y, `page ${i + 1}: '${item.str}'`).toBeGreaterThan(10);
        expect(item.y, `page ${i + 1}: '${item.str}'`).toBeLessThan(p.height - 10);
      }
    }
  });
});

describe('renderReportPdf: the yield check and the uncertainty budget', () => {
  it('a thick wall at 94 % of yield prints the bore stress, NEAR YIELD, and each gauge’s largest uncertainty', async () => {
    const all = squash((await readPdfPages(await renderReportPdf(await engine2Input()))).map((p) => p.text).join(' '));
    // √3·80·140²/(140² − 100²) = 282.9 MPa, 94.3 % of 300 MPa (REFERENCES "Added for engine v2")
    expect(all).toContain(squash('Yield check: von Mises at the bore (inner surface)'));
    expect(all).toContain(squash('282.9 MPa at 80 MPa = 94.3 % of yield'));
    expect(all).toContain(squash('NEAR YIELD'));
    expect(all).toContain(squash('Largest uncertainty'));
    expect(all).toContain(squash('Change (mm)'));
  }, 60_000);
  it('an engine 1 result reads too: its yield check from the stored fraction, not near yield', async () => {
    const input = buildSiReportInput();
    const all = squash((await readPdfPages(await renderReportPdf(input))).map((p) => p.text).join(' '));
    expect(all).toContain(squash('Yield check: von Mises at the bore'));
    expect(all).not.toContain(squash('NEAR YIELD'));
  }, 60_000);
});

describe('renderReportPdf variants', () => {
  it('shows no DRAFT once released, and both signatures', async () => {
    const pages = await readPdfPages(await renderReportPdf(buildReleasedReportInput()));
    for (const p of pages) expect(p.text).not.toContain('DRAFT');
    const all = pages.map((p) => p.text).join(' ');
    expect(all).toContain('Released record');
    expect(all).toContain('Release');
    expect(all).toContain('Tomas Lindqvist');
  }, 60_000);

  it('reports US units: psi and in', async () => {
    const pages = await readPdfPages(await renderReportPdf(buildUsReportInput()));
    const all = pages.map((p) => p.text).join(' ');
    expect(all).toContain('450 psi');
    expect(nfkc(all)).toContain(nfkc('µε/psi'));
    expect(all).toContain('72 in');
    expect(all).toContain('Pressure (psi)');
    expect(all).not.toContain('MPa');
  }, 60_000);

  it('is byte-for-byte repeatable for the same input', async () => {
    const a = await renderReportPdf(buildSiReportInput());
    const b = await renderReportPdf(buildSiReportInput());
    expect(a.equals(b)).toBe(true);
  }, 60_000);

  it('flags a signature on another reduction', async () => {
    const input = buildSiReportInput();
    input.signatures[0]!.reductionId = 33;
    const all = (await readPdfPages(await renderReportPdf(input))).map((p) => p.text).join(' ');
    expect(all).toContain('#33: not this reduction (#34)');
  }, 60_000);

  it('wraps a long gauge list onto more pages and repeats the table header on each', async () => {
    const input = buildSiReportInput();
    const template = input.result.gauges[0]!;
    const many: StoredGauge[] = Array.from({ length: 60 }, (_, i) => ({
      ...template,
      id: `G${String(i + 1).padStart(2, '0')}`,
      channel: `CH${i + 1}`,
    }));
    input.result.gauges = many;
    input.result.rosettes = [];
    input.dispositions = {};
    input.gaugeOutcomes = {};
    const pages = await readPdfPages(await renderReportPdf(input));
    const all = pages.map((p) => p.text).join(' ');
    for (const g of many) expect(all).toContain(g.id);
    const withRows = pages.filter((p) => /\bG\d\d\b/.test(p.text) && !p.text.includes('Strain versus pressure'));
    expect(withRows.length).toBeGreaterThanOrEqual(2);
    for (const p of withRows) expect(nfkc(p.text)).toMatch(new RegExp(nfkc('Predicted µε/MPa|Unloading slope µε/MPa')));
    // 60 figures, six to a page.
    expect(pages.filter((p) => p.text.includes('Strain versus pressure')).length).toBe(10);
    pages.forEach((p, i) => expect(p.text).toContain(`Page ${i + 1} of ${pages.length}`));
  }, 60_000);
});

describe('Inter glyph coverage', () => {
  // fontkit is pdfkit's own dependency: resolve it from there to open the exact files embedded.
  const fontkit = createRequire(createRequire(import.meta.url).resolve('pdfkit'))('fontkit') as {
    openSync(path: string): { hasGlyphForCodePoint(cp: number): boolean };
  };

  it.each([400, 600, 700] as const)('weight %i has a glyph for every symbol the report writes', (weight) => {
    const sample = 'µε/MPa σh σa ν R² ±10 % 90° 1–2 · × − ½ … ≤ ≥ √ 水 Łó Зоя';
    for (const run of splitTextRuns(sample)) {
      const font = fontkit.openSync(interFontPath(run.subset, weight));
      for (const ch of run.text)
        expect(font.hasGlyphForCodePoint(ch.codePointAt(0)!), `${ch} in ${run.subset} ${weight}`).toBe(true);
    }
  });

  it('draws names in the subset that holds their letters, and marks what no subset holds', async () => {
    expect(splitTextRuns('Łukasz')).toEqual([
      { subset: 'latin-ext', text: 'Ł' },
      { subset: 'latin', text: 'ukasz' },
    ]);
    expect(splitTextRuns('Ba\u0301rta')).toEqual([{ subset: 'latin', text: 'Bárta' }]);
    expect(splitTextRuns('水')).toEqual([{ subset: 'latin', text: '?' }]);
    const input = buildSiReportInput();
    input.dispositions.H2!.by = 'Łukasz Wróbel';
    input.signatures[0]!.name = 'Зоя Петрова';
    const all = (await readPdfPages(await renderReportPdf(input))).map((p) => p.text).join(' ');
    expect(all).toContain('Łukasz Wróbel');
    expect(all).toContain('Зоя Петрова');
  }, 60_000);

  it('sends Greek letters to the Greek subset and ≤ ≥ √ to the math face, never to ASCII', () => {
    expect(splitTextRuns('µε')).toEqual([
      { subset: 'latin', text: 'µ' },
      { subset: 'greek', text: 'ε' },
    ]);
    expect(splitTextRuns('R² ≤ 5 %')).toEqual([
      { subset: 'latin', text: 'R² ' },
      { subset: 'math', text: '≤' },
      { subset: 'latin', text: ' 5 %' },
    ]);
    expect(splitTextRuns('2.5·√(r t)').map((r) => r.subset)).toEqual(['latin', 'math', 'latin']);
  });

  it('prints the real ≤, ≥ and √ in the report text, embedded from Noto Sans Math', async () => {
    const input = buildSiReportInput();
    input.result.warnings.push('check: slope ≤ band, ratio ≥ 0.9, edge zone 2.5·√(r t)');
    const bytes = await renderReportPdf(input, { compress: false });
    const all = (await readPdfPages(bytes)).map((p) => p.text).join(' ');
    expect(all).toContain('≤');
    expect(all).toContain('≥');
    expect(all).toContain('√');
    expect(all).not.toMatch(/<=|>=|sqrt/);
    expect(bytes.toString('latin1')).toMatch(/\/BaseFont \/[A-Z]{6}\+NotoSansMath/);
  }, 60_000);
});
