// A realistic, invented test record for the renderer tests and for looking at the output:
// a closed carbon-steel cylinder with four uniaxial gauges (one flagged and accepted, one dead and
// excluded, one in the edge zone of a head seam) and one rectangular rosette. Predictions follow
// DESIGN 3.1 (Lamé at the outer surface, membrane at the mean radius); measured slopes are least
// squares fits of the synthetic hold points, so the figures and the numbers agree. The result
// has the shape an engine 1 reduction stored (no yield check, no budget): the renderers must read
// it as well as a current one. engine2Input builds a current one by running the engine.
import type { FlagCode, GaugeOutcome, Hold } from '../../../lib/reduction/types';
import type {
  StoredGauge as GaugeResult,
  StoredModel as ModelPrediction,
  StoredResult as ReductionResult,
  StoredRosette as RosetteResult,
} from '../../../lib/reduction/compat';
import { parsePlan, reduceLog, type PlanInput } from '../../../lib/reduction';
import { chunked, syntheticLog } from '../../../lib/reduction/testing/synthetic-log';
import type { ReportInput, UnitSystem } from '../report-input';
import { procedureFacts } from '../../../lib/signing';

interface Scenario {
  units: UnitSystem;
  insideDiameter: number;
  wallThickness: number;
  length: number;
  elasticModulus: number;
  poissonRatio: number;
  yieldStrength: number;
  testPressure: number;
  edgeDistance: number;
  farDistance: number;
}

const SI: Scenario = {
  units: 'SI',
  insideDiameter: 1800,
  wallThickness: 16,
  length: 6000,
  elasticModulus: 200000,
  poissonRatio: 0.3,
  yieldStrength: 260,
  testPressure: 3.4,
  edgeDistance: 60,
  farDistance: 1500,
};

const US: Scenario = {
  units: 'US',
  insideDiameter: 72,
  wallThickness: 0.625,
  length: 240,
  elasticModulus: 29_500_000,
  poissonRatio: 0.3,
  yieldStrength: 38_000,
  testPressure: 450,
  edgeDistance: 2.5,
  farDistance: 60,
};

interface GaugeSpec {
  id: string;
  channel: string;
  angleDeg: number;
  /** measured over predicted slope that the synthetic points follow */
  trueRatio: number;
  /** µε noise pattern amplitude on the loading points */
  noise: number;
  /** µε extra on the unloading branch at mid pressure */
  hysteresisGap: number;
  zeroShift: number;
  far: boolean;
  flags: FlagCode[];
  outcome: GaugeOutcome;
}

const GAUGES: GaugeSpec[] = [
  {
    id: 'H1',
    channel: 'SG1',
    angleDeg: 90,
    trueRatio: 0.985,
    noise: 1.1,
    hysteresisGap: 6,
    zeroShift: 2.4,
    far: true,
    flags: [],
    outcome: 'in-band',
  },
  {
    id: 'H2',
    channel: 'SG2',
    angleDeg: 90,
    trueRatio: 0.87,
    noise: 1.6,
    hysteresisGap: 9,
    zeroShift: 4.1,
    far: true,
    flags: ['outside-band'],
    outcome: 'flagged',
  },
  {
    id: 'H3',
    channel: 'SG3',
    angleDeg: 90,
    trueRatio: 0.004,
    noise: 1.2,
    hysteresisGap: 0.5,
    zeroShift: 0.6,
    far: true,
    flags: ['no-response', 'outside-band', 'nonlinear'],
    outcome: 'flagged',
  },
  {
    id: 'A1',
    channel: 'SG8',
    angleDeg: 0,
    trueRatio: 1.03,
    noise: 0.7,
    hysteresisGap: 2,
    zeroShift: -1.2,
    far: true,
    flags: [],
    outcome: 'in-band',
  },
  {
    id: 'E1',
    channel: 'SG9',
    angleDeg: 90,
    trueRatio: 0.78,
    noise: 1.4,
    hysteresisGap: 7,
    zeroShift: 3.0,
    far: false,
    flags: ['edge-zone'],
    outcome: 'not-compared',
  },
  {
    id: 'R1/A',
    channel: 'SG4',
    angleDeg: 0,
    trueRatio: 1.02,
    noise: 0.6,
    hysteresisGap: 2,
    zeroShift: 0.8,
    far: true,
    flags: [],
    outcome: 'in-band',
  },
  {
    id: 'R1/B',
    channel: 'SG5',
    angleDeg: 45,
    trueRatio: 0.99,
    noise: 0.9,
    hysteresisGap: 4,
    zeroShift: 1.5,
    far: true,
    flags: [],
    outcome: 'in-band',
  },
  {
    id: 'R1/C',
    channel: 'SG6',
    angleDeg: 90,
    trueRatio: 0.992,
    noise: 1.0,
    hysteresisGap: 5,
    zeroShift: 2.0,
    far: true,
    flags: [],
    outcome: 'in-band',
  },
];

/** The reason text exercises CSV quoting: a comma and double quotes. */
export const ACCEPT_REASON =
  'Gauge sits 40 mm from the "repad" edge, where the wall is locally stiffer; accepted, see note 4';
export const EXCLUDE_REASON =
  'Lead wire broken at the junction box: channel reads flat. Re-install before the next test';

function predictShell(s: Scenario, model: 'lame' | 'membrane'): ModelPrediction {
  const ri = s.insideDiameter / 2;
  const ro = ri + s.wallThickness;
  const E = s.elasticModulus;
  const nu = s.poissonRatio;
  let hoop: number, axial: number; // stress per unit pressure
  if (model === 'lame') {
    const A = (ri * ri) / (ro * ro - ri * ri);
    hoop = 2 * A; // Lamé, outer surface
    axial = A;
  } else {
    const rm = ri + s.wallThickness / 2;
    hoop = rm / s.wallThickness; // thin wall, mean radius
    axial = rm / (2 * s.wallThickness);
  }
  const eh = ((hoop - nu * axial) / E) * 1e6;
  const ea = ((axial - nu * hoop) / E) * 1e6;
  const er = ((-nu * (hoop + axial)) / E) * 1e6;
  const p = s.testPressure;
  // as engine 1 stored it: Lamé von Mises at the bore (σθ, σr = −p, σz), membrane the larger membrane stress
  const A = (ri * ri) / (ro * ro - ri * ri);
  const [bh, br, bz] = [A * (1 + (ro * ro) / (ri * ri)), -1, A];
  const bore = Math.sqrt(0.5 * ((bh - br) ** 2 + (br - bz) ** 2 + (bz - bh) ** 2)) * p;
  const vm = model === 'lame' ? bore : Math.max(hoop, axial) * p;
  return {
    model,
    hoopStrainPerPressure: eh,
    axialStrainPerPressure: ea,
    radialStrainPerPressure: er,
    hoopStress: hoop * p,
    axialStress: axial * p,
    diameterChange: eh * 1e-6 * p * (s.insideDiameter + 2 * s.wallThickness),
    lengthChange: ea * 1e-6 * p * s.length,
    thicknessChange: er * 1e-6 * p * s.wallThickness,
    yieldFraction: vm / s.yieldStrength,
  };
}

function fitLine(points: { pressure: number; strain: number }[]) {
  const n = points.length;
  const mx = points.reduce((a, p) => a + p.pressure, 0) / n;
  const my = points.reduce((a, p) => a + p.strain, 0) / n;
  let sxx = 0,
    sxy = 0,
    syy = 0;
  for (const p of points) {
    sxx += (p.pressure - mx) ** 2;
    sxy += (p.pressure - mx) * (p.strain - my);
    syy += (p.strain - my) ** 2;
  }
  const slope = sxy / sxx;
  const intercept = my - slope * mx;
  const sse = points.reduce((a, p) => a + (p.strain - intercept - slope * p.pressure) ** 2, 0);
  const residualSD = Math.sqrt(sse / (n - 2));
  const se = residualSD / Math.sqrt(sxx);
  const t95 = 3.182; // Student t, 3 degrees of freedom (5 loading points)
  return {
    slope,
    intercept,
    rSquared: syy === 0 ? 1 : 1 - sse / syy,
    residualSD,
    ci: [slope - t95 * se, slope + t95 * se] as [number, number],
  };
}

function buildHolds(s: Scenario): Hold[] {
  const levels: [number, Hold['branch']][] = [
    [0, 'zero'],
    [0.25, 'loading'],
    [0.5, 'loading'],
    [0.75, 'loading'],
    [1, 'loading'],
    [0.75, 'unloading'],
    [0.5, 'unloading'],
    [0.25, 'unloading'],
    [0, 'return'],
  ];
  return levels.map(([f, branch], index) => ({
    index,
    pressure: f * s.testPressure,
    start: index * 600,
    end: index * 600 + 300,
    branch,
    samples: 300,
  }));
}

function buildGauge(spec: GaugeSpec, s: Scenario, lame: ModelPrediction, holds: Hold[]): GaugeResult {
  const rad = (spec.angleDeg * Math.PI) / 180;
  const predictedSlope =
    lame.axialStrainPerPressure * Math.cos(rad) ** 2 + lame.hoopStrainPerPressure * Math.sin(rad) ** 2;
  const m = predictedSlope * spec.trueRatio;
  const pattern = [0, 1, -0.8, 0.6, -0.3, 0.5, -0.6, 0.9, 0];
  const holdStrains = holds.map((h, i) => {
    if (h.branch === 'zero') return 0;
    if (h.branch === 'return') return spec.zeroShift;
    const f = h.pressure / s.testPressure;
    const gap = h.branch === 'unloading' ? spec.hysteresisGap * 4 * f * (1 - f) + spec.zeroShift * (1 - f) : 0;
    return m * h.pressure + spec.noise * (pattern[i] ?? 0) + gap;
  });
  const points: GaugeResult['points'] = holds.map((h, i) => ({
    pressure: h.pressure,
    strain: holdStrains[i] ?? 0,
    branch: h.branch === 'zero' || h.branch === 'loading' ? 'loading' : 'unloading',
  }));
  const loading = fitLine(points.filter((p) => p.branch === 'loading'));
  const unloading = fitLine(
    points.filter((p) => p.branch === 'unloading').concat([points.find((p) => p.pressure === s.testPressure)!]),
  );
  const peakStrain = Math.max(...holdStrains.map((v) => Math.abs(v ?? 0)));
  const maxGap = Math.max(
    ...holds
      .filter((h) => h.branch === 'unloading')
      .map((h) => {
        const i = holds.indexOf(h);
        const j = holds.findIndex((k) => k.branch === 'loading' && k.pressure === h.pressure);
        return Math.abs(holdStrains[i]! - holdStrains[j]!);
      }),
  );
  const ratio = loading.slope / predictedSlope;
  const notes = spec.id.startsWith('R1/') ? ['transverse sensitivity corrected with the rosette grids'] : [];
  return {
    id: spec.id,
    channel: spec.channel,
    angleDeg: spec.angleDeg,
    measuredSlope: loading.slope,
    predictedSlope,
    ratio,
    deviation: ratio - 1,
    slopeCI95: loading.ci,
    rSquared: loading.rSquared,
    residualSD: loading.residualSD,
    intercept: loading.intercept,
    unloadingSlope: unloading.slope,
    hysteresis: peakStrain > 0 ? maxGap / peakStrain : null,
    zeroShift: spec.zeroShift,
    peakStrain,
    effectiveThickness: spec.trueRatio > 0.1 ? s.wallThickness / ratio : null,
    distanceToDiscontinuity: spec.far ? s.farDistance : s.edgeDistance,
    flags: spec.flags,
    outcome: spec.outcome,
    holdStrains,
    points,
    notes,
  };
}

/** Rectangular rosette, grid A along the axis: principal strains and plane-stress stresses. */
function buildRosette(grids: GaugeResult[], s: Scenario, lame: ModelPrediction): RosetteResult {
  const [a, b, c] = grids.map((g) => g.measuredSlope ?? 0);
  if (a === undefined || b === undefined || c === undefined) throw new Error('a rectangular rosette has three grids');
  const centre = (a + c) / 2;
  const radius = Math.SQRT1_2 * Math.hypot(a - b, b - c);
  const e1 = centre + radius;
  const e2 = centre - radius;
  let angle = (0.5 * Math.atan2(2 * b - a - c, a - c) * 180) / Math.PI;
  if (angle <= -90) angle += 180;
  const k = s.elasticModulus / (1 - s.poissonRatio ** 2);
  const s1 = k * (e1 + s.poissonRatio * e2) * 1e-6 * s.testPressure;
  const s2 = k * (e2 + s.poissonRatio * e1) * 1e-6 * s.testPressure;
  const vm = Math.sqrt(s1 * s1 - s1 * s2 + s2 * s2);
  return {
    id: 'R1',
    kind: 'rosette-rectangular',
    angleDeg: 0,
    principalStrains: [e1, e2],
    principalAngleDeg: angle,
    principalStresses: [s1, s2],
    vonMises: vm,
    yieldFraction: vm / s.yieldStrength,
    predictedPrincipalStrains: [lame.hoopStrainPerPressure, lame.axialStrainPerPressure],
    flags: [],
  };
}

/** What the fixture's reviewer signed (the words of src/lib/signing.ts, shortened). */
export const FIXTURE_REVIEW_STATEMENT =
  'I, Ines Okafor, have reviewed reduction 34 (engine 1.0.0) of test 12 "Hydrotest T-101, after nozzle repair". ' +
  'The test is recorded as conducted under: written test procedure WP-HT-031 rev B.';

function buildInput(s: Scenario): ReportInput {
  const lame = predictShell(s, 'lame');
  const membrane = predictShell(s, 'membrane');
  const ri = s.insideDiameter / 2;
  const rm = ri + s.wallThickness / 2;
  const holds = buildHolds(s);
  const gauges = GAUGES.map((g) => buildGauge(g, s, lame, holds));
  const rosette = buildRosette(
    gauges.filter((g) => g.id.startsWith('R1/')),
    s,
    lame,
  );
  const pressureUnit = s.units === 'SI' ? 'MPa' : 'psi';
  const result: ReductionResult = {
    engineVersion: '1.0.0',
    model: 'lame',
    units: s.units,
    pressureUnit,
    testPressure: s.testPressure,
    predicted: {
      lame,
      membrane,
      membraneOverLame: membrane.hoopStrainPerPressure / lame.hoopStrainPerPressure - 1,
      edgeZoneDistance: 2.5 * Math.sqrt(rm * s.wallThickness),
    },
    holds,
    gauges,
    rosettes: [rosette],
    verdict: 'flagged',
    warnings: ['3 missing samples in channel SG3 (first at line 1412)'],
    log: {
      rows: 5400,
      missingSamples: 3,
      timeSpan: [0, 5400],
      peakPressure: s.testPressure * 1.004,
      pressureUnitInLog: pressureUnit,
      usedHolds: true,
    },
  };
  const at = (iso: string) => new Date(iso);
  return {
    generatedAt: at('2026-12-03T09:30:00Z'),
    draft: true,
    test: { id: 12, name: 'Hydrotest T-101, after nozzle repair', status: 'reviewed' },
    vessel: {
      tag: 'T-101',
      name: 'Demineralised water buffer tank',
      shape: 'cylinder',
      ends: 'closed',
      insideDiameter: s.insideDiameter,
      wallThickness: s.wallThickness,
      length: s.length,
    },
    material: {
      name: 'carbon steel, generic',
      elasticModulus: s.elasticModulus,
      poissonRatio: s.poissonRatio,
      yieldStrength: s.yieldStrength,
    },
    units: s.units,
    model: 'lame',
    testPressure: s.testPressure,
    procedure: procedureFacts({
      units: s.units,
      procedure: {
        reference: 'WP-HT-031 rev B',
        codeEdition: 'the governing pressure vessel code, 2025 edition',
        testMedium: 'demineralised water',
        testTemperature: s.units === 'SI' ? 14 : 57.2,
        witness: 'R. Adeyemi, authorised inspector',
      },
    }),
    tolerances: {
      slopeBand: 0.1,
      minRSquared: 0.995,
      hysteresis: 0.05,
      zeroShiftMicrostrain: 20,
      zeroShiftFraction: 0.02,
      noResponseMicrostrain: 10,
      yieldFraction: 0.9,
      holdCreepMicrostrain: 10,
      holdCreepFraction: 0.01,
      principalDirectionDeg: 10,
      bandMode: 'fixed',
    },
    reductionId: 34,
    engineVersion: '1.0.0',
    logs: [
      {
        filename: 'T-101_hydro_2026-12-02.csv',
        sha256: '3f1c9a0e8b7d6c5f4e3d2c1b0a99887766554433221100ffeeddccbbaa998877',
        rows: 5400,
      },
      {
        filename: 'T-101_hydro_2026-12-02_part2.csv',
        sha256: 'a0b1c2d3e4f5061728394a5b6c7d8e9f00112233445566778899aabbccddeeff',
        rows: null,
      },
    ],
    result,
    dispositions: {
      H2: { outcome: 'accepted', reason: ACCEPT_REASON, by: 'Ines Okafor', at: at('2026-12-02T16:40:00Z') },
      H3: { outcome: 'excluded', reason: EXCLUDE_REASON, by: 'Ines Okafor', at: at('2026-12-02T16:44:00Z') },
    },
    gaugeOutcomes: {
      H1: 'in-band',
      H2: 'flagged',
      H3: 'excluded',
      A1: 'in-band',
      E1: 'not-compared',
      'R1/A': 'in-band',
      'R1/B': 'in-band',
      'R1/C': 'in-band',
    },
    verdict: 'conforms',
    signatures: [
      {
        kind: 'review',
        name: 'Ines Okafor',
        email: 'engineer@example.com',
        at: at('2026-12-02T17:05:00Z'),
        reductionId: 34,
        statement: FIXTURE_REVIEW_STATEMENT,
      },
    ],
  };
}

/** SI record (MPa, mm), draft, reviewed but not released. */
export function buildSiReportInput(): ReportInput {
  return buildInput(SI);
}

/** The same scenario in US customary units (psi, in). */
export function buildUsReportInput(): ReportInput {
  return buildInput(US);
}

/** A released record: not draft, with review and release signatures. */
export function buildReleasedReportInput(): ReportInput {
  const input = buildInput(SI);
  input.draft = false;
  input.test.status = 'released';
  input.signatures.push({
    kind: 'release',
    name: 'Tomas Lindqvist',
    email: 'qa@example.com',
    at: new Date('2026-12-03T08:15:00Z'),
    reductionId: 34,
    statement:
      'I, Tomas Lindqvist, release the strain record of reduction 34 (engine 1.0.0) of test 12, reviewed by Ines Okafor.',
  });
  return input;
}

/**
 * A current (engine 2) record: the thick-walled vessel of REFERENCES "Added for engine v2" (ID
 * 200 mm, wall 40 mm, 80 MPa, yield 300 MPa: 94 % of yield at the bore), reduced by the engine from
 * a synthetic log, nothing dispositioned.
 */
export async function engine2Input(): Promise<ReportInput> {
  const planInput: PlanInput = {
    units: 'SI',
    vessel: { shape: 'cylinder', ends: 'closed', insideDiameter: 200, wallThickness: 40, length: 1000 },
    material: { name: 'high-strength steel, generic', elasticModulus: 200000, poissonRatio: 0.3, yieldStrength: 300 },
    model: 'lame',
    testPressure: 80,
    columns: { time: 'time_s', pressure: 'P [MPa]' },
    gauges: [
      { id: 'H1', kind: 'uniaxial', channels: ['SG1'], angleDeg: 90, distanceToDiscontinuity: 400 },
      { id: 'A1', kind: 'uniaxial', channels: ['SG2'], angleDeg: 0, distanceToDiscontinuity: 400 },
    ],
  };
  const plan = parsePlan(planInput);
  const { result } = await reduceLog(
    plan,
    chunked(syntheticLog(plan, { rateHz: 1, holdSeconds: 30, rampSeconds: 15 })),
  );
  const base = buildSiReportInput();
  return {
    ...base,
    vessel: { ...base.vessel, insideDiameter: 200, wallThickness: 40, length: 1000 },
    material: { name: 'high-strength steel, generic', elasticModulus: 200000, poissonRatio: 0.3, yieldStrength: 300 },
    testPressure: 80,
    tolerances: plan.tolerances,
    engineVersion: result.engineVersion,
    result,
    dispositions: {},
    gaugeOutcomes: {},
    verdict: result.verdict,
  };
}
