// Server-render every review island with the fixture: it must not touch window, and it must carry
// the labels, words and shapes a reader relies on (colour is never the only cue).
import { createElement as h } from 'react';
import { renderToString } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import type { FlagCode, GaugeOutcome } from '../../lib/reduction/types';
import DeviationOverview from './DeviationOverview';
import DevelopedShellMap from './DevelopedShellMap';
import FlagChip from './FlagChip';
import FlagGlossary from './FlagGlossary';
import { FLAG_CODES, FLAG_GLOSSARY } from './flag-glossary';
import GaugeTable from './GaugeTable';
import OutcomeBadge from './OutcomeBadge';
import RosetteCard from './RosetteCard';
import SafetyCaution from './SafetyCaution';
import StrainPressurePlot from './StrainPressurePlot';
import TestPressureHelper from './TestPressureHelper';
import TimeHistoryPlot from './TimeHistoryPlot';
import VerdictBanner from './VerdictBanner';
import { ChosenPressureCautions } from './TestPressureHelper';
import YieldCheckCard from './YieldCheckCard';
import UncertaintyBudgetTable from './UncertaintyBudgetTable';
import { FIXTURE_CHANNELS, FIXTURE_GAUGES, FIXTURE_PLAN, FIXTURE_RESULT, FIXTURE_ROSETTE } from './fixtures';

const text = (html: string) =>
  html
    .replace(/<!-- -->/g, '')
    .replace(/<[^>]+>/g, ' ')
    .replace(/&#x27;/g, "'")
    .replace(/&amp;/g, '&')
    .replace(/\s+/g, ' ');
const results = Object.fromEntries(FIXTURE_GAUGES.map((g) => [g.id, g]));

describe('OutcomeBadge and FlagChip', () => {
  it.each<[GaugeOutcome, string, string]>([
    ['in-band', '●', 'In band'],
    ['flagged', '▲', 'Flagged'],
    ['excluded', '✕', 'Excluded'],
    ['not-compared', '◆', 'Not compared'],
  ])('%s shows glyph %s and the word %s', (outcome, glyph, word) => {
    const t = text(renderToString(h(OutcomeBadge, { outcome })));
    expect(t).toContain(glyph);
    expect(t).toContain(word);
  });
  it('shows a chip in words, with the plain explanation and the code in its title', () => {
    const html = renderToString(h(FlagChip, { code: 'reversed-sign' }));
    const meaning = FLAG_GLOSSARY['reversed-sign'].meaning.replace(/'/g, '&#x27;');
    expect(html).toContain(`title="${meaning} (flag code: reversed-sign)"`);
    expect(text(html).trim()).toBe(FLAG_GLOSSARY['reversed-sign'].title);
  });
});

describe('flag glossary', () => {
  it('explains all ten flag codes of DESIGN 3.3 with causes and a next step', () => {
    const all: FlagCode[] = [
      'outside-band',
      'nonlinear',
      'hysteresis',
      'zero-shift',
      'no-response',
      'reversed-sign',
      'edge-zone',
      'near-yield',
      'hold-creep',
      'principal-direction',
    ];
    expect([...FLAG_CODES].sort()).toEqual([...all].sort());
    for (const c of all) {
      expect(FLAG_GLOSSARY[c].causes.length).toBeGreaterThan(0);
      expect(FLAG_GLOSSARY[c].next.length).toBeGreaterThan(10);
    }
    expect(FLAG_GLOSSARY['reversed-sign'].causes.join(' ')).toMatch(/lead wires swapped/);
    expect(FLAG_GLOSSARY['near-yield'].next).toMatch(/During the test: do not raise the pressure further/);
    expect(FLAG_GLOSSARY['near-yield'].next).toMatch(/After the test/);
    const t = text(renderToString(h(FlagGlossary, {})));
    for (const c of all) expect(t).toContain(c);
  });
});

describe('charts render on the server without a window', () => {
  it('StrainPressurePlot: caption with ratio, R², outcome and a legend', () => {
    const t = text(
      renderToString(
        h(StrainPressurePlot, { gauge: results.D1!, testPressure: 3.4, slopeBand: 0.1, pressureUnit: 'MPa' }),
      ),
    );
    expect(t).toContain('Gauge D1');
    expect(t).toContain('1.127');
    expect(t).toContain('0.9944');
    expect(t).toContain('Flagged');
    expect(t).toMatch(/Loading holds.*Unloading holds.*Predicted.*Band ±10 %/);
  });
  it('TimeHistoryPlot: a loading state and a labelled checkbox per channel', () => {
    const html = renderToString(
      h(TimeHistoryPlot, { seriesUrl: '/api/tests/12/series', channels: FIXTURE_CHANNELS, pressureUnit: 'MPa' }),
    );
    expect(text(html)).toContain('Loading time history');
    expect(html.match(/type="checkbox"/g)).toHaveLength(FIXTURE_CHANNELS.length);
    expect(text(html)).toContain('Reset zoom');
  });
});

describe('overview, map, table', () => {
  it('DeviationOverview: a focusable button per plotted gauge; the edge-zone gauge listed, not plotted', () => {
    const html = renderToString(h(DeviationOverview, { gauges: FIXTURE_GAUGES, slopeBand: 0.1 }));
    expect(html.match(/role="button" tabindex="0"/g)).toHaveLength(8);
    expect(html).not.toContain('data-gauge="H3"');
    expect(text(html)).toMatch(/Not plotted: H3 \(not compared, edge zone\)/);
    expect(text(html)).toContain('Rosette grids');
  });
  it('DevelopedShellMap: every placed gauge, the unplaced one listed, features labelled', () => {
    const html = renderToString(
      h(DevelopedShellMap, { plan: FIXTURE_PLAN, results, edgeZoneDistance: 301.33, lengthUnit: 'mm' }),
    );
    for (const id of ['H1', 'H2', 'A1', 'R1', 'A2', 'H3']) expect(html).toContain(`data-gauge="${id}"`);
    const t = text(html);
    expect(t).toMatch(/No position in the plan: D1/);
    expect(t).toContain('nozzle N1');
    expect(t).toContain('thickness change T1');
    expect(t).not.toMatch(/nozzle nozzle/);
    expect(t).toContain('Edge zone');
  });
  it('DevelopedShellMap: a sphere gets a note instead', () => {
    const html = renderToString(
      h(DevelopedShellMap, {
        plan: { ...FIXTURE_PLAN, vessel: { ...FIXTURE_PLAN.vessel, shape: 'sphere' } },
        results,
        edgeZoneDistance: 300,
        lengthUnit: 'mm',
      }),
    );
    expect(text(html)).toContain('A sphere has no developed shell map');
  });
  it('GaugeTable: sortable headers, flags and outcomes, and the actions slot', () => {
    const html = renderToString(
      h(GaugeTable, {
        gauges: FIXTURE_GAUGES,
        pressureUnit: 'MPa',
        renderActions: (g) => h('span', null, `act-${g.id}`),
      }),
    );
    expect(html.match(/<tr/g)).toHaveLength(FIXTURE_GAUGES.length + 1);
    expect(html).not.toContain('aria-sort'); // plan order until a header is chosen
    expect(html.match(/<th scope="col"[^>]*><button/g)).toHaveLength(11);
    const sorted = renderToString(
      h(GaugeTable, { gauges: FIXTURE_GAUGES, pressureUnit: 'MPa', initialSort: { key: 'ratio', dir: 'descending' } }),
    );
    expect(sorted).toContain('aria-sort="descending"');
    expect(sorted.indexOf('data-gauge="H3"')).toBeLessThan(sorted.indexOf('data-gauge="H1"'));
    expect(html).toContain('data-flag="reversed-sign"');
    expect(text(html)).toContain('act-R1/C');
    expect(text(html)).toContain('µε/MPa');
  });
});

describe('yield check and uncertainty budget', () => {
  it('YieldCheckCard: where the largest stress sits, the fraction, and what to do near yield', () => {
    const near = { ...FIXTURE_RESULT.yieldCheck, stress: 282.9, fraction: 0.943, pressure: 80, nearYield: true };
    const t = text(renderToString(h(YieldCheckCard, { yieldCheck: near, pressureUnit: 'MPa' })));
    expect(t).toContain('von Mises at the bore (inner surface), Lamé thick wall');
    expect(t).toContain('282.9 MPa');
    expect(t).toContain('94.3 % of yield');
    expect(t).toMatch(/Near yield\. During the test: do not raise the pressure further/);
    expect(t).toMatch(/After the test: the responsible engineer assesses the wall/);
    const calm = text(
      renderToString(h(YieldCheckCard, { yieldCheck: FIXTURE_RESULT.yieldCheck, pressureUnit: 'MPa' })),
    );
    expect(calm).not.toContain('Near yield.');
  });
  it('UncertaintyBudgetTable: U95, the dominant input, every input with its share, assumptions marked', () => {
    const t = text(renderToString(h(UncertaintyBudgetTable, { gauge: results.H1!, pressureUnit: 'MPa' })));
    expect(t).toMatch(/U95 \(k = 2\): ± \d+\.\d+ µε\/MPa\s*, mostly from elastic modulus/);
    expect(t).toContain('wall thickness (assumed)');
    expect(t).toContain('± 3.0 %');
    const axial = text(renderToString(h(UncertaintyBudgetTable, { gauge: results.A1!, pressureUnit: 'MPa' })));
    expect(axial).toMatch(/mostly from Poisson's ratio/);
  });
  it('says so when a result has no budget', () => {
    const old = { ...results.H1!, predictedU95: null, uncertaintyBudget: [] };
    expect(text(renderToString(h(UncertaintyBudgetTable, { gauge: old, pressureUnit: 'MPa' })))).toMatch(
      /no uncertainty budget/,
    );
  });
  it('GaugeTable names the largest input of each gauge’s band', () => {
    const t = text(renderToString(h(GaugeTable, { gauges: FIXTURE_GAUGES, pressureUnit: 'MPa' })));
    expect(t).toContain('Prediction U95');
    expect(t).toContain('elastic modulus');
  });
});

describe('rosette, verdict, cautions, test pressure', () => {
  it('RosetteCard: principal strains, angle, von Mises against yield', () => {
    const html = renderToString(h(RosetteCard, { rosette: FIXTURE_ROSETTE, pressureUnit: 'MPa', testPressure: 3.4 }));
    const t = text(html);
    expect(t).toMatch(/ε1 238\.8 237\.0 1\.008/); // measured, predicted (µε/MPa), ratio
    expect(t).toContain('µε/MPa');
    expect(t).toContain('89.7°');
    expect(t).toContain('165.6 MPa');
    expect(t).toContain('Yield strength (plan) 260.0 MPa'); // 165.57 / 0.6368
    expect(html).toContain('role="meter"');
    expect(t).toContain('near-yield 90 %');
  });
  it('VerdictBanner counts flagged gauges awaiting a disposition and those marked for retest', () => {
    const t = text(
      renderToString(h(VerdictBanner, { verdict: FIXTURE_RESULT.verdict, counts: { awaiting: 3, retest: 1 } })),
    );
    expect(t).toContain('Strain comparison verdict: Flagged');
    expect(t).toContain('Flagged: gauges outside tolerance, awaiting a disposition, or marked for retest.');
    expect(t).toContain('3 gauges outside tolerance await a disposition before the review can be signed');
    expect(t).toContain('1 gauge marked for retest keeps the verdict flagged; the review can still be signed');
  });
  it('VerdictBanner says a conforming comparison is not acceptance of the hydrotest', () => {
    const t = text(renderToString(h(VerdictBanner, { verdict: 'conforms', counts: { awaiting: 0, retest: 0 } })));
    expect(t).toContain('Strain comparison verdict: Conforms');
    expect(t).toMatch(/not acceptance of the hydrostatic test/);
    expect(t).toMatch(/leak examination and the authorised inspector’s witness/);
    expect(t).not.toMatch(/outside the acceptance limits/);
  });
  it('SafetyCaution defers to the code, the engineer and the inspector', () => {
    const t = text(renderToString(h(SafetyCaution, {})));
    expect(t).toMatch(/stores energy/);
    expect(t).toMatch(/governing code/);
    expect(t).toMatch(/does not replace.*responsible engineer and the authorised inspector/);
  });
  it('a chosen test pressure is checked against yield and says where it is measured and the metal temperature', () => {
    const near = text(
      renderToString(
        h(ChosenPressureCautions, { pressure: 2.25, fraction: 0.94, limit: 0.9, pressureUnit: 'MPa', digits: 3 }),
      ),
    );
    expect(near).toContain(
      'Yield check at 2.250 MPa: the largest stress in the wall is 94.0 % of yield (near-yield limit 90 %): near yield',
    );
    expect(near).toMatch(/read at the top of the vessel; at the lowest point the water adds its weight/);
    expect(near).toMatch(/minimum design metal temperature/);
    const clear = text(
      renderToString(
        h(ChosenPressureCautions, { pressure: 1.95, fraction: 0.62, limit: 0.9, pressureUnit: 'MPa', digits: 3 }),
      ),
    );
    expect(clear).not.toMatch(/near yield\./);
  });
  it('TestPressureHelper shows every rule for MAWP 1.5 MPa (REFERENCES.md, Test pressure rules [derived])', () => {
    const t = text(renderToString(h(TestPressureHelper, { pressureUnit: 'MPa', initialMawp: 1.5 })));
    for (const v of ['1.950 MPa', '2.145 MPa', '2.250 MPa', '1.650 MPa']) expect(t).toContain(v);
    expect(t.match(/Use this/g)).toHaveLength(5);
    expect(t).toMatch(/governing code edition and the jurisdiction decide/);
  });
});
