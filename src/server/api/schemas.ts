// The request schemas of the API: every JSON body, query and path parameter an endpoint parses.
// The endpoints parse with these objects and the API description (description.ts) publishes the
// same objects, so the documentation cannot drift from the validation. Plain zod and the pure
// lists only: no database, request or framework imports (the description is built from them).
import { z } from 'zod';
import { dispositionOutcomes, noteKinds, testStatuses } from '../../lib/domain';
import { roles } from '../../lib/roles';

/** What an API token may do: `read` every GET; `upload` logs, live sessions and reductions. */
export const tokenScopes = ['read', 'upload'] as const;
export type TokenScope = (typeof tokenScopes)[number];

// ── path parameters ────────────────────────────────────────────────────────────────────────

/** A numeric id in the path; anything but a positive integer answers 404 (`idParam`). */
export const idPathParam = z.coerce.number().int().positive().describe('A numeric id (a positive integer).');
/** The token of an inspector's share link: 256 random bits, base64url. */
export const shareTokenPathParam = z.string().min(20).max(100).describe('The token of an inspector share link.');

// ── query parameters ───────────────────────────────────────────────────────────────────────

/** `?limit=&offset=` of every list that pages (limit 1–200, default 50). */
export const pageQuery = z.object({
  limit: z.coerce.number().int().min(1).max(200).default(50).describe('How many items, 1–200.'),
  offset: z.coerce.number().int().min(0).default(0).describe('How many items to skip.'),
});

/** GET /api/tests: `status` is a comma-separated list in the URL, split before its values are checked. */
export const testListQuery = pageQuery.extend({
  status: z
    .string()
    .optional()
    .transform((v) => (v === undefined ? undefined : v.split(',').filter(Boolean)))
    .pipe(z.array(z.enum(testStatuses)).optional())
    .describe(`Comma-separated statuses to keep: ${testStatuses.join(', ')}.`),
  vesselId: z.coerce.number().int().positive().optional().describe('Only the tests of this vessel.'),
});

/** GET …/series: a window of the time history, decimated to at most `points` per channel. */
export const seriesQuery = z
  .object({
    from: z.coerce.number().optional().describe('Start of the window (s, or sample index without a time column).'),
    to: z.coerce.number().optional().describe('End of the window; greater than `from`.'),
    points: z.coerce.number().int().min(10).max(5000).default(1000).describe('At most this many buckets.'),
    channels: z.string().max(4000).optional().describe('Comma-separated channel names; all when absent.'),
    reduction: z.coerce
      .number()
      .int()
      .positive()
      .optional()
      .describe('A reduction id; its answer never changes (cached for a year). Without it: the current one.'),
  })
  .refine((q) => q.from === undefined || q.to === undefined || q.to > q.from, {
    path: ['to'],
    message: 'must be greater than from',
  });

// ── bodies: catalogue ──────────────────────────────────────────────────────────────────────

export const materialBody = z.object({
  name: z.string().trim().min(1).max(160),
  elasticModulusMPa: z.number().gt(500, 'is in MPa: 200 GPa is 200000'),
  poissonRatio: z.number().gte(0).lte(0.5),
  yieldStrengthMPa: z.number().gt(0),
});

/** PATCH /api/materials/{id}: any of the fields. */
export const materialPatchBody = materialBody.partial();

const vesselFeature = z.object({
  id: z.string().max(60).optional(),
  name: z.string().max(120).optional(),
  kind: z.enum(['head', 'nozzle', 'support', 'thickness-change']),
  axialPosition: z.number(),
  clockDeg: z.number().min(0).max(360).optional(),
  size: z.number().min(0).optional(),
});

export const vesselBody = z
  .object({
    tag: z.string().trim().min(1).max(60),
    name: z.string().trim().min(1).max(160),
    shape: z.enum(['cylinder', 'sphere']),
    ends: z.enum(['closed', 'open']).default('closed'),
    insideDiameterMm: z.number().gt(0),
    wallThicknessMm: z.number().gt(0),
    lengthMm: z.number().gt(0).nullable().optional(),
    features: z.array(vesselFeature).default([]),
    materialId: z.number().int().positive().nullable().optional(),
    units: z.enum(['SI', 'US']).default('SI'),
  })
  .refine((v) => v.shape === 'sphere' || (v.lengthMm ?? null) !== null, {
    path: ['lengthMm'],
    message: 'is required for a cylinder',
  })
  .refine((v) => v.wallThicknessMm < v.insideDiameterMm / 2, {
    path: ['wallThicknessMm'],
    message: 'must be less than the inside radius',
  });

/** PATCH /api/vessels/{id}: fields of the vessel; the merged vessel is then checked as a whole. */
export const vesselPatchBody = z
  .record(z.string(), z.unknown())
  .describe('Any fields of a vessel (as in POST /api/vessels); the vessel they make is validated as a whole.');

// ── bodies: tests and plans ────────────────────────────────────────────────────────────────

/** The test plan (DESIGN 4.1); the plan service validates it and answers 422 listing every problem. */
export const planBody = z.unknown().describe('The test plan (DESIGN 4.1): vessel, material, gauges, columns, holds.');

export const testCreateBody = z.object({
  name: z.string().trim().min(1, 'give the test a name').max(200),
  plan: z
    .unknown()
    .refine((p) => p !== undefined, 'is required (the test plan, DESIGN 4.1)')
    .describe('The test plan (DESIGN 4.1); its vessel and material are created or matched.'),
  vesselId: z.number().int().positive().optional(),
});

export const testPatchBody = z.object({ name: z.string().trim().min(1).max(200) });

export const noteBody = z.object({
  kind: z.enum(noteKinds).default('general'),
  body: z.string().trim().min(1, 'write what happened').max(4000),
});

export const dispositionBody = z.object({
  gaugeId: z.string().trim().min(1).max(64),
  outcome: z.enum(dispositionOutcomes),
  reason: z.string().trim().min(3, 'is required: say why (at least a few words)').max(4000),
});

/** The body of a signature (POST …/review and …/release, DESIGN 5): the signer's password again. */
export const signatureBody = z.object({
  reductionId: z.number().int().positive('is the reduction you reviewed (its id)'),
  password: z.string().min(1, 'is required: signing asks for your password again').max(1024),
  statement: z.string().trim().max(2000, 'at most 2000 characters').optional(),
  /** the statement as the sign-off dialog showed it; when given, it must be what would be signed now */
  shownStatement: z.string().max(8000, 'at most 8000 characters').optional(),
});

export const shareLinkBody = z.object({
  email: z.email('must be an e-mail address').max(254).optional(),
  expiresInDays: z.number().int().min(1, 'at least 1 day').max(90, 'at most 90 days').default(14),
});

// ── bodies: accounts ───────────────────────────────────────────────────────────────────────

export const inviteBody = z.object({
  email: z.email('must be an e-mail address').max(254),
  name: z.string().trim().min(1, 'is required').max(120),
  role: z.enum(roles),
});

export const userPatchBody = z
  .object({ role: z.enum(roles).optional(), disabled: z.boolean().optional() })
  .refine((b) => b.role !== undefined || b.disabled !== undefined, { message: 'give `role` or `disabled`' });

export const tokenBody = z.object({
  name: z.string().trim().min(1, 'give the token a name, e.g. the DAQ PC it lives on').max(120),
  scopes: z
    .array(z.enum(tokenScopes))
    .min(1, 'choose at least one scope: read, upload')
    .default(['read', 'upload'])
    .transform((s) => [...new Set(s)].sort()),
  expiresInDays: z.number().int().min(1, 'at least 1 day').max(365, 'at most 365 days').default(90),
});

export const passwordForgotBody = z.object({ email: z.string().trim().min(3).max(254) });

export const passwordSetBody = z.object({
  token: z.string().min(20).max(100),
  password: z.string().min(1).max(1024),
});
