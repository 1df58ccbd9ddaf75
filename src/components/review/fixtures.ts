// An invented hydrotest for the review components' tests and visual checks: a closed carbon-steel
// cylinder (ID 1800 mm, wall 16 mm, 6000 mm long, E 200 000 MPa, ν 0.3, yield 260 MPa) tested to
// 3.4 MPa in four holds up and three down. Predictions are the engine's Lamé values for that
// vessel; measured slopes, R², intervals and hysteresis were fitted from the hold strains below.
// The uncertainty budgets are the shares the engine finds for that vessel with the default inputs.
import type { BudgetEntry, GaugeResult, Hold, ReductionResult, RosetteResult } from '../../lib/reduction/types';
import type { ShellMapPlan } from './shell-map-layout';
import type { Engine2GaugeFields } from '../../lib/reduction/compat';

const HOLD_PRESSURES = [0, 0.851, 1.702, 2.548, 3.402, 2.551, 1.699, 0.849, 0.004];
const HOLD_BRANCHES: Hold['branch'][] = [
  'zero',
  'loading',
  'loading',
  'loading',
  'loading',
  'unloading',
  'unloading',
  'unloading',
  'return',
];

export const FIXTURE_HOLDS: Hold[] = HOLD_PRESSURES.map((pressure, index) => ({
  index,
  pressure,
  start: 30 + index * 210,
  end: 180 + index * 210,
  branch: HOLD_BRANCHES[index]!,
  samples: 1500,
}));

type GaugeRow = Omit<GaugeResult, 'points' | 'deviation' | 'notes' | Engine2GaugeFields> &
  Partial<Pick<GaugeResult, Engine2GaugeFields>> & { notes?: string[] };

/** Default-input budget of a slope: relative contributions of each input (hoop and axial gauges differ). */
function budgetOf(slope: number, hoopLike: boolean): { predictedU95: number; uncertaintyBudget: BudgetEntry[] } {
  const rel: [BudgetEntry['input'], number, number, string][] = hoopLike
    ? [
        ['elasticModulus', 0.03, 0.03, 'relative'],
        ['wallThickness', 0.32, 0.0199, 'mm'],
        ['gaugeFactor', 0.005, 0.005, 'relative'],
        ['poissonRatio', 0.015, 0.0088, ''],
        ['transverseSensitivity', 0.005, 0.0018, 'absolute'],
        ['insideDiameter', 3.6, 0.002, 'mm'],
        ['misalignmentDeg', 1, 0.0001, '°'],
      ]
    : [
        ['poissonRatio', 0.015, 0.0429, ''],
        ['transverseSensitivity', 0.005, 0.0231, 'absolute'],
        ['elasticModulus', 0.03, 0.03, 'relative'],
        ['wallThickness', 0.32, 0.0199, 'mm'],
        ['gaugeFactor', 0.005, 0.005, 'relative'],
        ['insideDiameter', 3.6, 0.002, 'mm'],
        ['misalignmentDeg', 1, 0.0001, '°'],
      ];
  const c = rel.map(([, , r]) => r * Math.abs(slope));
  const uc = Math.sqrt(c.reduce((a, x) => a + x * x, 0));
  const uncertaintyBudget = rel
    .map(([input, u, , unit], i) => ({
      input,
      value: 0,
      standardUncertainty: u,
      unit,
      contribution: c[i]!,
      share: (c[i]! * c[i]!) / (uc * uc),
      assumed: true,
    }))
    .sort((a, b) => b.contribution - a.contribution);
  return { predictedU95: 2 * uc, uncertaintyBudget };
}

/** Hold averages → the points the fits used: zero and rising holds load, peak-down holds unload. */
function toPoints(holdStrains: (number | null)[]): GaugeResult['points'] {
  return holdStrains.flatMap((strain, i) => {
    if (strain === null) return [];
    const branch = i <= 4 ? 'loading' : 'unloading';
    return [{ pressure: HOLD_PRESSURES[i]!, strain, branch } as const];
  });
}

function gauge(row: GaugeRow): GaugeResult {
  const hoopLike = Math.abs(Math.sin((row.angleDeg * Math.PI) / 180)) > 0.5;
  return {
    ...budgetOf(row.predictedSlope, hoopLike),
    bandSlope:
      row.outcome === 'not-compared'
        ? null
        : ([0.9 * row.predictedSlope, 1.1 * row.predictedSlope].sort((a, b) => a - b) as [number, number]),
    bandBasis: 'relative',
    transverseCorrection: 'none',
    pairedWith: null,
    holdCreep: 0.6,
    headPressure: 0,
    effectiveSamples: null,
    ...row,
    deviation: row.ratio === null ? null : row.ratio - 1,
    points: toPoints(row.holdStrains),
    notes: row.notes ?? [],
  };
}

const HOOP = 236.956; // µε/MPa, Lamé outer surface
const AXIAL = 55.754;

export const FIXTURE_GAUGES: GaugeResult[] = [
  gauge({
    id: 'H1',
    channel: 'SG1',
    angleDeg: 90,
    measuredSlope: 233.725,
    predictedSlope: HOOP,
    ratio: 0.9864,
    slopeCI95: [232.378, 235.072],
    rSquared: 0.99999,
    residualSD: 1.14,
    intercept: 0.49,
    unloadingSlope: 233.225,
    hysteresis: 0.0016,
    zeroShift: 3.1,
    peakStrain: 795.1,
    effectiveThickness: 16.22,
    distanceToDiscontinuity: 1800,
    flags: [],
    outcome: 'in-band',
    holdStrains: [0, 200.4, 397.2, 597.1, 795.1, 597.5, 396.2, 199.1, 3.1],
  }),
  gauge({
    id: 'H2',
    channel: 'SG2',
    angleDeg: 90,
    measuredSlope: 262.781,
    predictedSlope: HOOP,
    ratio: 1.109,
    slopeCI95: [261.474, 264.089],
    rSquared: 0.99999,
    residualSD: 1.1,
    intercept: -0.25,
    unloadingSlope: 260.723,
    hysteresis: 0.0019,
    zeroShift: 4.6,
    peakStrain: 893.9,
    effectiveThickness: 14.44,
    distanceToDiscontinuity: 600,
    flags: ['outside-band'],
    outcome: 'flagged',
    holdStrains: [0, 222.4, 448.4, 668.5, 893.9, 668.3, 446.7, 224, 4.6],
  }),
  gauge({
    id: 'A1',
    channel: 'SG3',
    angleDeg: 0,
    measuredSlope: 57.075,
    predictedSlope: AXIAL,
    ratio: 1.0237,
    slopeCI95: [56.275, 57.875],
    rSquared: 0.99994,
    residualSD: 0.68,
    intercept: 0.2,
    unloadingSlope: 56.802,
    hysteresis: 0.0026,
    zeroShift: 1.2,
    peakStrain: 194,
    effectiveThickness: 15.63,
    distanceToDiscontinuity: 1800,
    flags: [],
    outcome: 'in-band',
    holdStrains: [0, 49.2, 96.7, 146.4, 194, 146.1, 96.3, 48.7, 1.2],
  }),
  gauge({
    id: 'A2',
    channel: 'SG7',
    angleDeg: 0,
    measuredSlope: -54.817,
    predictedSlope: AXIAL,
    ratio: -0.9832,
    slopeCI95: [-55.619, -54.014],
    rSquared: 0.99994,
    residualSD: 0.68,
    intercept: -0.08,
    unloadingSlope: -54.494,
    hysteresis: 0.0064,
    zeroShift: -1.4,
    peakStrain: -186.3,
    effectiveThickness: null,
    distanceToDiscontinuity: 900,
    flags: ['reversed-sign', 'outside-band'],
    outcome: 'flagged',
    holdStrains: [0, -47.1, -92.6, -140.5, -186.3, -139.7, -93.8, -46, -1.4],
  }),
  gauge({
    id: 'H3',
    channel: 'SG8',
    angleDeg: 90,
    measuredSlope: 278.707,
    predictedSlope: HOOP,
    ratio: 1.1762,
    slopeCI95: [276.229, 281.185],
    rSquared: 0.99998,
    residualSD: 2.09,
    intercept: 1.03,
    unloadingSlope: 277.708,
    hysteresis: 0.0012,
    zeroShift: 6,
    peakStrain: 947.8,
    effectiveThickness: 13.62,
    distanceToDiscontinuity: 106,
    flags: ['edge-zone'],
    outcome: 'not-compared',
    holdStrains: [0, 239.8, 473.9, 713.5, 947.8, 713.7, 473.6, 238.7, 6],
    notes: ['106 mm from nozzle N1, inside the edge zone (301 mm): reported, not compared.'],
  }),
  gauge({
    id: 'D1',
    channel: 'SG9',
    angleDeg: 30,
    measuredSlope: 113.905,
    predictedSlope: 101.055,
    ratio: 1.1272,
    slopeCI95: [98.255, 129.555],
    rSquared: 0.99444,
    residualSD: 13.22,
    intercept: -11.97,
    unloadingSlope: 107.982,
    hysteresis: 0.0975,
    zeroShift: 31.5,
    peakStrain: 387.8,
    effectiveThickness: 14.21,
    distanceToDiscontinuity: null,
    flags: ['outside-band', 'nonlinear', 'hysteresis', 'zero-shift'],
    outcome: 'flagged',
    holdStrains: [0, 79.6, 169, 272.3, 387.8, 305.5, 206.8, 112, 31.5],
  }),
  gauge({
    id: 'R1/A',
    channel: 'SG4',
    angleDeg: 0,
    measuredSlope: 56.852,
    predictedSlope: AXIAL,
    ratio: 1.0197,
    slopeCI95: [56.178, 57.525],
    rSquared: 0.99996,
    residualSD: 0.57,
    intercept: 0.08,
    unloadingSlope: 56.814,
    hysteresis: 0.0021,
    zeroShift: 0.9,
    peakStrain: 193.4,
    effectiveThickness: 15.69,
    distanceToDiscontinuity: 1200,
    flags: [],
    outcome: 'in-band',
    holdStrains: [0, 48.9, 96.1, 145.4, 193.4, 145.8, 96.3, 48.6, 0.9],
  }),
  gauge({
    id: 'R1/B',
    channel: 'SG5',
    angleDeg: 45,
    measuredSlope: 148.936,
    predictedSlope: 146.355,
    ratio: 1.0176,
    slopeCI95: [147.81, 150.062],
    rSquared: 0.99998,
    residualSD: 0.95,
    intercept: -0.32,
    unloadingSlope: 148.134,
    hysteresis: 0.0014,
    zeroShift: 2.2,
    peakStrain: 506.7,
    effectiveThickness: 15.73,
    distanceToDiscontinuity: 1200,
    flags: [],
    outcome: 'in-band',
    holdStrains: [0, 125.6, 254.2, 378.3, 506.7, 378.8, 253.5, 125.5, 2.2],
  }),
  gauge({
    id: 'R1/C',
    channel: 'SG6',
    angleDeg: 90,
    measuredSlope: 238.795,
    predictedSlope: HOOP,
    ratio: 1.0078,
    slopeCI95: [237.505, 240.084],
    rSquared: 0.99999,
    residualSD: 1.09,
    intercept: 0.55,
    unloadingSlope: 238.254,
    hysteresis: 0.0011,
    zeroShift: 3.4,
    peakStrain: 812.3,
    effectiveThickness: 15.88,
    distanceToDiscontinuity: 1200,
    flags: [],
    outcome: 'in-band',
    holdStrains: [0, 204.7, 406.1, 610.1, 812.3, 610.6, 405.2, 203.8, 3.4],
  }),
];

export const FIXTURE_ROSETTE: RosetteResult = {
  id: 'R1',
  kind: 'rosette-rectangular',
  angleDeg: 0,
  principalStrains: [238.802, 56.845],
  principalAngleDeg: 89.65,
  principalStresses: [191.19, 96.01],
  vonMises: 165.57,
  yieldFraction: 0.6368,
  predictedPrincipalStrains: [HOOP, AXIAL],
  expectedPrincipalAngleDeg: 90,
  stressesPerUnitPressure: [56.232, 28.238],
  vonMisesPerUnitPressure: 48.697,
  flags: [],
  notes: [],
};

export const FIXTURE_RESULT: ReductionResult = {
  engineVersion: '0.1.0',
  model: 'lame',
  units: 'SI',
  pressureUnit: 'MPa',
  testPressure: 3.4,
  predicted: {
    lame: {
      model: 'lame',
      hoopStrainPerPressure: 236.9562,
      axialStrainPerPressure: 55.7544,
      radialStrainPerPressure: -125.4474,
      hoopStress: 189.565,
      axialStress: 94.782,
      dimensionChanges: {
        insideDiameter: 1.49,
        meanDiameter: 1.483,
        outsideDiameter: 1.476,
        length: 1.137,
        thickness: -0.007,
      },
      diameterChange: 1.476,
      lengthChange: 1.137,
      thicknessChange: -0.007,
      yieldCheck: { stress: 170.06, fraction: 0.6541, surface: 'inner', pressure: 3.4 },
      yieldFraction: 0.6541,
    },
    membrane: {
      model: 'membrane',
      hoopStrainPerPressure: 241.1875,
      axialStrainPerPressure: 56.75,
      radialStrainPerPressure: -127.6875,
      hoopStress: 192.95,
      axialStress: 96.475,
      dimensionChanges: {
        insideDiameter: 1.4959,
        meanDiameter: 1.489,
        outsideDiameter: 1.4821,
        length: 1.158,
        thickness: -0.0069,
      },
      diameterChange: 1.489,
      lengthChange: 1.158,
      thicknessChange: -0.0069,
      yieldCheck: { stress: 167.1, fraction: 0.6427, surface: 'mid-wall', pressure: 3.4 },
      yieldFraction: 0.6427,
    },
    membraneOverLame: 0.01786,
    edgeZoneDistance: 301.33,
  },
  holds: FIXTURE_HOLDS,
  gauges: FIXTURE_GAUGES,
  rosettes: [FIXTURE_ROSETTE],
  verdict: 'flagged',
  yieldCheck: {
    stress: 170.06,
    fraction: 0.6541,
    surface: 'inner',
    pressure: 3.4,
    model: 'lame',
    limit: 0.9,
    nearYield: false,
  },
  bandMode: 'fixed',
  cycles: [],
  uncertaintyInputs: [],
  warnings: [
    'Gauge H3 is 106 mm from nozzle N1, inside the edge zone (301 mm): reported, not compared.',
    'Gauge D1 has no position on the shell: distance to a discontinuity unknown.',
  ],
  log: {
    rows: 19000,
    missingSamples: 0,
    timeSpan: [0, 1900],
    peakPressure: 3.402,
    pressureUnitInLog: 'MPa',
    pressureConversion: {
      fromUnit: 'MPa',
      toUnit: 'MPa',
      absolute: false,
      factor: 1,
      atmosphere: 0,
      atmosphereSource: 'none',
    },
    usedHolds: true,
  },
};

/** The plan's vessel and gauges, as the developed shell map takes them. */
export const FIXTURE_PLAN: ShellMapPlan = {
  vessel: {
    shape: 'cylinder',
    insideDiameter: 1800,
    wallThickness: 16,
    length: 6000,
    features: [
      { id: 'N1', kind: 'nozzle', axialPosition: 4700, clockDeg: 10, size: 300 },
      { id: 'S1', kind: 'support', axialPosition: 900, size: 250 },
      { id: 'S2', kind: 'support', axialPosition: 5100, size: 250 },
      { id: 'T1', kind: 'thickness-change', axialPosition: 1200 },
    ],
  },
  gauges: [
    { id: 'H1', kind: 'uniaxial', angleDeg: 90, axialPosition: 3000, clockDeg: 90 },
    { id: 'H2', kind: 'uniaxial', angleDeg: 90, axialPosition: 1800, clockDeg: 270 },
    { id: 'A1', kind: 'uniaxial', angleDeg: 0, axialPosition: 3000, clockDeg: 100 },
    { id: 'R1', kind: 'rosette-rectangular', angleDeg: 0, axialPosition: 2400, clockDeg: 135 },
    { id: 'A2', kind: 'uniaxial', angleDeg: 0, axialPosition: 4200, clockDeg: 180 },
    { id: 'H3', kind: 'uniaxial', angleDeg: 90, axialPosition: 4500, clockDeg: 20 },
    { id: 'D1', kind: 'uniaxial', angleDeg: 30 },
  ],
};

/** Gauge channels in the fixture log, in plan order. */
export const FIXTURE_CHANNELS = ['SG1', 'SG2', 'SG3', 'SG4', 'SG5', 'SG6', 'SG7', 'SG8', 'SG9'];
