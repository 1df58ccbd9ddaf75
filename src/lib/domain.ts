// The record's vocabulary (DESIGN 2): the fixed lists of statuses and kinds that the database
// schema stores as enums and that pages, endpoints and islands validate against. Pure constants,
// so every layer can import them without reaching the database.

export const testStatuses = ['draft', 'logging', 'reduced', 'reviewed', 'released'] as const;
export type TestStatus = (typeof testStatuses)[number];

export const verdicts = ['conforms', 'flagged', 'incomplete'] as const;
export type Verdict = (typeof verdicts)[number];

export const gaugeKinds = ['uniaxial', 'rosette-rectangular', 'rosette-delta'] as const;
export type GaugeKind = (typeof gaugeKinds)[number];

export const noteKinds = ['pressure-held', 'leak-seen', 'gauge-rezeroed', 'general'] as const;
export type NoteKind = (typeof noteKinds)[number];

export const dispositionOutcomes = ['accepted', 'excluded', 'retest'] as const;
export type DispositionOutcome = (typeof dispositionOutcomes)[number];

export const signatureKinds = ['review', 'release'] as const;
export type SignatureKind = (typeof signatureKinds)[number];

export const jobStatuses = ['queued', 'running', 'done', 'failed'] as const;
export type JobStatus = (typeof jobStatuses)[number];

export const outboxStatuses = ['pending', 'sent', 'failed'] as const;
export type OutboxStatus = (typeof outboxStatuses)[number];

export const shapes = ['cylinder', 'sphere'] as const;
export const endKinds = ['closed', 'open'] as const;
