// Plain-language meaning of each flag code (DESIGN 3.3), what usually causes it, and what to do
// next. Shown as chip tooltips and in the glossary beside the review. Pure data.
import type { FlagCode } from '../../lib/reduction/types';
import { NEAR_YIELD_ADVICE } from '../../lib/verdict-words';

export interface FlagExplanation {
  code: FlagCode;
  /** a short name for the chip */
  title: string;
  /** what the flag says about the measurement */
  meaning: string;
  /** what usually produces it, most common first */
  causes: string[];
  /** the usual next step */
  next: string;
  /** the flag may mean the vessel itself is at risk, not just the gauge */
  safety?: boolean;
}

export const FLAG_CODES: FlagCode[] = [
  'near-yield',
  'hold-creep',
  'reversed-sign',
  'no-response',
  'outside-band',
  'nonlinear',
  'hysteresis',
  'zero-shift',
  'edge-zone',
  'principal-direction',
];

export const FLAG_GLOSSARY: Record<FlagCode, FlagExplanation> = {
  'outside-band': {
    code: 'outside-band',
    title: 'Outside band',
    meaning:
      'The measured strain per unit pressure differs from the elastic prediction by more than the tolerance band allows.',
    causes: [
      'the wall thickness or elastic modulus assumed in the plan is not the one in the vessel',
      'the gauge angle in the plan does not match the bonded gauge',
      'the gauge sits near a discontinuity (nozzle, support, weld, thickness change)',
      'the gauge factor was not set on the instrument, or set to a different value',
    ],
    next: 'Check the plan inputs against the drawings and the installation record, then compare with the effective thickness shown for the gauge.',
  },
  nonlinear: {
    code: 'nonlinear',
    title: 'Not linear',
    meaning:
      'On the way up the strain does not follow a straight line in pressure: the loading fit explains too little of the scatter (R² below the limit).',
    causes: [
      'local yielding',
      'bending of the shell at that spot',
      'a gauge that is coming loose',
      'air trapped in the vessel, so pressure and volume settle unevenly',
    ],
    next: 'Look at the strain–pressure plot: a curve bending upward near the top holds points to yielding; scatter at every hold points to the gauge or its wiring.',
  },
  hysteresis: {
    code: 'hysteresis',
    title: 'Hysteresis',
    meaning:
      'At the same pressure the strain on the way down differs from the strain on the way up by more than the limit (as a share of peak strain).',
    causes: [
      'yielding during the top hold',
      'friction at the supports, released in steps',
      'creep of the adhesive or of the metal',
    ],
    next: 'Compare with the zero shift and with the neighbouring gauges; a single gauge alone usually points to its bond.',
  },
  'zero-shift': {
    code: 'zero-shift',
    title: 'Zero shift',
    meaning:
      'After the pressure returned to zero the gauge kept a strain above the limit: it did not come back to where it started.',
    causes: [
      'local yielding (a permanent set)',
      'creep of the adhesive',
      'thermal drift of the gauge or the water',
      'a support or clamp that slipped and stayed put',
    ],
    next: 'Check the water and metal temperature log; a permanent set with hysteresis and curvature on the same gauge needs the engineer before anything else.',
  },
  'no-response': {
    code: 'no-response',
    title: 'No response',
    meaning:
      'The channel barely moved with pressure (peak strain below the floor), or it sat flat or at the end of its range.',
    causes: [
      'a broken or disconnected lead wire',
      'a dead or wrongly mapped acquisition channel',
      'a gauge that has come off the surface',
    ],
    next: 'Check the column mapping, the bridge completion and the lead wires before the next test.',
  },
  'reversed-sign': {
    code: 'reversed-sign',
    title: 'Reversed sign',
    meaning: 'The gauge reads compression where the prediction is tension, or the other way round.',
    causes: [
      'lead wires swapped at the bridge',
      'the gauge bonded on the wrong axis',
      'a sign convention set the other way in the acquisition unit',
    ],
    next: 'Compare the magnitude with the prediction: a good magnitude with the wrong sign is almost always wiring or set-up, not the vessel.',
  },
  'edge-zone': {
    code: 'edge-zone',
    title: 'Edge zone',
    meaning:
      'The gauge is closer to a head seam, nozzle, support or thickness change than 2.5·√(r t) (r the mean radius, t the wall thickness). There the shell bends, and the membrane prediction does not describe it, so the gauge is reported but not compared.',
    causes: [
      'the gauge was placed there on purpose to watch a discontinuity',
      'a position in the plan that is not the one on the vessel',
    ],
    next: 'Judge it against a local analysis (hand calculation or finite elements), not against the membrane prediction.',
  },
  'near-yield': {
    code: 'near-yield',
    title: 'Near yield',
    meaning: 'The stress at test pressure is close to the material’s yield strength (above the set share of yield).',
    causes: [
      'a test pressure set too high for the material and thickness',
      'a wall thinner than assumed',
      'a yield strength in the plan lower than the certificate',
    ],
    next: NEAR_YIELD_ADVICE,
    safety: true,
  },
  'hold-creep': {
    code: 'hold-creep',
    title: 'Creep in hold',
    meaning:
      'While the pressure stayed at test pressure, the strain kept changing by more than the limit (the larger of an absolute value and a share of peak strain).',
    causes: [
      'the metal yielding at that spot',
      'a leak, with the pump making up the pressure',
      'a gauge or its adhesive coming loose',
      'the water or the metal warming or cooling during the hold',
    ],
    next: 'Do not raise the pressure further. Compare with the neighbouring gauges and the pressure trace: creep on several gauges points to the vessel, on one gauge to its bond; consult the responsible engineer.',
    safety: true,
  },
  'principal-direction': {
    code: 'principal-direction',
    title: 'Principal direction',
    meaning:
      'The rosette’s largest principal strain points further from the predicted direction (hoop on a cylinder) than the set angle.',
    causes: [
      'the rosette bonded at another angle than the plan says',
      'the grids wired to the channels in another order',
      'local bending or shear from a nearby nozzle, support or weld',
    ],
    next: 'Check the installation record and the channel mapping; if both are right, the field at that spot is not the membrane field and needs a local analysis.',
  },
};

/** The explanation for a flag code, e.g. for a tooltip. */
export function explainFlag(code: FlagCode): FlagExplanation {
  return FLAG_GLOSSARY[code];
}
