// Plan fields in words, for messages people read: a gauge by its id, a field by its label.
// Pure (no framework): the engine's plan errors, the API and the plan editor use the same words.

const list = (v: unknown): unknown[] => (Array.isArray(v) ? v : []);

/** "Gauge A1"; a gauge with no id yet by its place in the list, counted from 1. */
export function gaugeName(g: { id?: unknown } | undefined, index: number): string {
  return typeof g?.id === 'string' && g.id.trim() ? `Gauge ${g.id}` : `Gauge ${index + 1} in the list (no id yet)`;
}

const WORDS: Record<string, string> = {
  units: 'Units',
  model: 'Model',
  testPressure: 'Test pressure',
  gauges: 'Gauges',
  vessel: 'Vessel',
  material: 'Material',
  columns: 'Log columns',
  atmosphericPressure: 'atmospheric pressure',
  tolerances: 'Tolerances',
  uncertainty: 'Uncertainty of',
  holdDetection: 'Hold detection',
  features: 'Features',
  name: 'name',
  shape: 'shape',
  ends: 'ends',
  insideDiameter: 'inside diameter',
  wallThickness: 'wall thickness',
  length: 'length',
  elasticModulus: 'elastic modulus',
  poissonRatio: "Poisson's ratio",
  yieldStrength: 'yield strength',
  pressure: 'pressure column',
  time: 'time column',
  slopeBand: 'slope band',
  minRSquared: 'minimum R²',
  hysteresis: 'hysteresis limit',
  zeroShiftMicrostrain: 'zero shift (µε)',
  zeroShiftFraction: 'zero shift (fraction of peak)',
  noResponseMicrostrain: 'no-response floor',
  yieldFraction: 'near-yield fraction',
  holdCreepMicrostrain: 'hold creep (µε)',
  holdCreepFraction: 'hold creep (fraction of peak)',
  principalDirectionDeg: 'principal direction limit',
  bandMode: 'band mode',
  misalignmentDeg: 'gauge misalignment',
  id: 'id',
  kind: 'kind',
  channels: 'channels',
  angleDeg: 'angle',
  gaugeFactor: 'gauge factor',
  instrumentGaugeFactor: 'instrument gauge factor',
  transverseSensitivity: 'transverse sensitivity',
  distanceToDiscontinuity: 'distance to discontinuity',
  axialPosition: 'axial position',
  clockDeg: 'clock position',
  size: 'size',
  pressureTapElevation: 'pressure tap elevation',
  testFluidDensity: 'test fluid density',
  leadResistance: 'lead resistance',
  gaugeResistance: 'gauge resistance',
  leadWiring: 'lead wiring',
  elevation: 'elevation',
  pairWith: 'paired gauge',
  procedure: 'Test conduct',
  reference: 'written test procedure',
  codeEdition: 'governing code and edition',
  testMedium: 'test medium',
  testTemperature: 'metal temperature during the test',
  witness: 'witness',
};

/**
 * A plan path in words, naming a gauge by its id: `gauges[1].channels[2]` → "Gauge R1, channel of
 * grid C"; `columns.pressure` → "Log columns: pressure column". For messages people read (the
 * editor, the API's 422, the command line); the path itself stays in the error's details.
 */
export function labelForPath(path: readonly (string | number)[], plan: unknown): string {
  if (path.length === 0) return 'Plan';
  const [head, ...rest] = path;
  const root = (plan ?? {}) as { gauges?: unknown };
  if (head === 'gauges' && typeof rest[0] === 'number') {
    const g = list(root.gauges)[rest[0]] as { id?: unknown; kind?: unknown } | undefined;
    const who = gaugeName(g, rest[0]);
    if (rest[1] === 'channels' && typeof rest[2] === 'number')
      return g?.kind === 'uniaxial' || g?.kind === undefined
        ? `${who}, channel`
        : `${who}, channel of grid ${'ABC'[rest[2]] ?? rest[2] + 1}`;
    return rest.length > 1 ? `${who}, ${WORDS[String(rest[1])] ?? rest[1]}` : who;
  }
  if (head === 'vessel' && rest[0] === 'features' && typeof rest[1] === 'number') {
    return `Feature ${rest[1] + 1}${rest[2] !== undefined ? ' ' + (WORDS[String(rest[2])] ?? rest[2]) : ''}`;
  }
  if (head === 'procedure' && typeof rest[0] === 'string') return `Test conduct: ${WORDS[rest[0]] ?? rest[0]}`;
  if (head === 'uncertainty' && typeof rest[0] === 'string') return `Uncertainty of the ${WORDS[rest[0]] ?? rest[0]}`;
  const words = path.map((p) => (typeof p === 'number' ? String(p + 1) : (WORDS[p] ?? p)));
  if (head === 'columns' && rest.length > 0) words.shift();
  return words.join(' ').replace(/^./, (c) => c.toUpperCase());
}

const COUNT_WORDS = ['none', 'one', 'two', 'three', 'four', 'five', 'six'];

/** 2 → "two"; large counts stay digits. */
export function countWord(n: number): string {
  return COUNT_WORDS[n] ?? String(n);
}

/**
 * One plan problem as a sentence a person reads: "Gauge A1 is uniaxial and needs one channel;
 * it lists two." A message that already names its field (it starts with "Gauge ") stands alone;
 * any other is put after the field's label.
 */
export function describePlanIssue(path: readonly (string | number)[], message: string, plan: unknown): string {
  if (/^Gauge /.test(message)) return message;
  return `${labelForPath(path, plan)}: ${message}`;
}
