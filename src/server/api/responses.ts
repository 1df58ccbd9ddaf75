// The answers of the API as zod schemas, for the description (description.ts) and for tests that
// check an answer against what is published. Small answers are described field by field; large
// records (a test's record, a reduction's result) name their main fields and allow more.
import { z } from 'zod';
import { errorCatalogue } from '../errors';
import { inputErrorCodes } from '../../lib/reduction/errors';
import { dispositionOutcomes, jobStatuses, testStatuses, verdicts } from '../../lib/domain';
import { roles } from '../../lib/roles';
import { tokenScopes } from './schemas';

const id = z.number().int().positive();
const timestamp = z.string().describe('An instant, ISO 8601 in UTC.');

/** Every code an error answer may carry: the server's catalogue and the engine's input errors. */
export const errorCodes = [
  ...new Set([...(Object.keys(errorCatalogue) as (keyof typeof errorCatalogue)[]), ...inputErrorCodes]),
];

/** The error envelope of DESIGN 5, with the request id a user can quote to an administrator. */
export const errorEnvelope = z
  .object({
    error: z.object({
      code: z.enum(errorCodes).describe('A permanent code from the error catalogue.'),
      message: z.string().describe('What happened and what to do, for a person.'),
      details: z
        .unknown()
        .describe(
          'null, or more about the problem: `issues` [{path, message}] for a bad body, `line` and `column` for a bad log, `expected` for a live chunk out of turn, `retryAfterSeconds` when throttled.',
        ),
      requestId: z.string().optional().describe('The id of the request (also in the X-Request-Id header).'),
    }),
  })
  .describe('The error envelope of every error answer.');

export const created = z.object({ id });
export const revoked = z.object({ id, revoked: z.literal(true) });

const page = { limit: z.number().int(), offset: z.number().int() };
const pagedList = (item: z.ZodType) => z.object({ items: z.array(item), total: z.number().int().optional(), ...page });
const list = (item: z.ZodType) => z.object({ items: z.array(item) });

export const healthAnswer = z.object({ ok: z.boolean(), db: z.boolean(), storage: z.boolean() });
export const readyAnswer = z.object({
  ready: z.boolean(),
  db: z.boolean(),
  storage: z.boolean(),
  migrations: z.string().describe('`current`, or what is missing.'),
  draining: z.boolean().describe('true while the server shuts down gracefully.'),
});

export const material = z.looseObject({
  id,
  name: z.string(),
  elasticModulusMPa: z.number(),
  poissonRatio: z.number(),
  yieldStrengthMPa: z.number(),
});

export const vessel = z.looseObject({
  id,
  tag: z.string(),
  name: z.string(),
  shape: z.enum(['cylinder', 'sphere']),
  ends: z.enum(['closed', 'open']),
  insideDiameterMm: z.number(),
  wallThicknessMm: z.number(),
  lengthMm: z.number().nullable(),
  materialId: id.nullable(),
});

export const testRow = z.looseObject({
  id,
  name: z.string(),
  status: z.enum(testStatuses),
  vesselId: id,
  currentReductionId: id.nullable(),
});

export const testSummary = testRow.extend({
  vessel: vessel.nullable(),
  material: material.nullable(),
  owner: z.looseObject({ id, name: z.string() }).nullable(),
  logCount: z.number().int(),
  currentReduction: z
    .object({ id, status: z.enum(jobStatuses), engineVersion: z.string().nullable(), finishedAt: timestamp.nullable() })
    .nullable(),
});

export const logRow = z.looseObject({
  id,
  sha256: z.string().describe('SHA-256 of the stored bytes, hex.'),
  rows: z.number().int(),
  sizeBytes: z.number().int(),
  timeStart: z.number().nullable(),
  timeEnd: z.number().nullable(),
});

export const logUploaded = z.object({
  id,
  sha256: z.string(),
  rows: z.number().int(),
  sizeBytes: z.number().int(),
  timeStart: z.number().nullable(),
  timeEnd: z.number().nullable(),
  existing: z.boolean().describe('true when the same bytes were stored before (answer 200).'),
});

export const reductionAnswer = z.object({
  id,
  testId: id,
  status: z.enum(jobStatuses),
  progress: z.number().min(0).max(1),
  attempts: z.number().int(),
  error: z.string().nullable(),
  superseded: z.boolean(),
  engineVersion: z.string().nullable(),
  logIds: z.array(id),
  createdAt: timestamp,
  startedAt: timestamp.nullable(),
  finishedAt: timestamp.nullable(),
  result: z
    .looseObject({ verdict: z.enum(verdicts), gauges: z.array(z.looseObject({ id: z.string() })) })
    .nullable()
    .describe('The result (DESIGN 4.2) when the status is `done`, else null.'),
});

export const reductionRow = z.looseObject({
  id,
  status: z.enum(jobStatuses),
  progress: z.number(),
  createdAt: timestamp,
});

export const noteRow = z.looseObject({ id, kind: z.string(), body: z.string(), createdAt: timestamp });

export const dispositionDone = z.object({ id, verdict: z.enum(verdicts) });
export const dispositions = z.object({
  latest: z.array(z.looseObject({ gaugeId: z.string(), outcome: z.enum(dispositionOutcomes), reason: z.string() })),
  history: z.array(z.looseObject({ gaugeId: z.string(), outcome: z.enum(dispositionOutcomes) })),
});

export const record = z
  .looseObject({
    test: z.object({
      id,
      name: z.string(),
      status: z.enum(testStatuses),
      verdict: z.enum(verdicts).nullable(),
      flaggedCount: z.number().int().nullable(),
      createdAt: timestamp,
      lastActivityAt: timestamp.nullable(),
    }),
    vessel: z.looseObject({ id, tag: z.string() }).nullable(),
    material: z.looseObject({ id, name: z.string() }).nullable(),
    plan: z.unknown().describe('The plan (DESIGN 4.1).'),
    reduction: z
      .object({
        id,
        status: z.enum(jobStatuses),
        progress: z.number(),
        engineVersion: z.string().nullable(),
        finishedAt: timestamp.nullable(),
        error: z.string().nullable(),
      })
      .nullable(),
    result: z
      .looseObject({ verdict: z.enum(verdicts).nullable(), gauges: z.array(z.looseObject({ id: z.string() })) })
      .nullable()
      .describe('The result (DESIGN 4.2) with the latest dispositions applied.'),
    dispositions: z.unknown(),
    signatures: z.array(
      z.object({
        kind: z.enum(['review', 'release']),
        name: z.string(),
        email: z.string().nullable().describe('Empty for an inspector’s link.'),
        at: timestamp,
        reductionId: id,
        statement: z.string(),
      }),
    ),
    logs: z.array(
      z.object({
        id,
        filename: z.string().nullable(),
        sha256: z.string(),
        sizeBytes: z.number().int(),
        rows: z.number().int(),
        timeStart: z.number().nullable(),
        timeEnd: z.number().nullable(),
        createdAt: timestamp,
      }),
    ),
    openFlags: z.unknown(),
  })
  .describe('The whole record of a test: plan, current result with dispositions applied, signatures, logs.');

export const shareRecord = record.extend({ link: z.object({ expiresAt: timestamp }) });

export const signed = z.object({
  id,
  reductionId: id,
  statement: z.string().describe('The full statement signed: the standard attestation and the remark.'),
  snapshotSha256: z.string().optional().describe('Release only: SHA-256 of the frozen record.'),
});

export const shareLinkCreated = z.object({
  id,
  url: z.string().describe('`{base}/share/{token}`'),
  expiresAt: timestamp,
});
export const shareLinkRow = z.looseObject({
  id,
  email: z.string().nullable(),
  expiresAt: timestamp,
  revokedAt: timestamp.nullable(),
});

export const auditEvent = z.looseObject({ id, at: timestamp, action: z.string(), actor: z.string().nullable() });
export const auditVerify = z.object({
  ok: z.boolean(),
  rows: z.number().int(),
  firstBadRow: z.number().int().nullable(),
  problem: z.string().nullable().optional(),
  snapshot: z.object({ sha256: z.string(), ok: z.boolean() }).nullable(),
});

export const apiTokenRow = z.looseObject({
  id,
  name: z.string(),
  prefix: z.string(),
  scopes: z.union([z.array(z.enum(tokenScopes)), z.string()]),
  expiresAt: timestamp.nullable(),
});
export const apiTokenCreated = z.object({
  id,
  name: z.string(),
  token: z.string().describe('The token itself: shown in this answer only, never again.'),
  prefix: z.string(),
  scopes: z.array(z.enum(tokenScopes)),
  expiresAt: timestamp,
});

export const userRow = z.looseObject({
  id,
  email: z.string(),
  name: z.string(),
  role: z.enum(roles),
  disabled: z.boolean(),
});
export const userUpdated = z.object({ id, role: z.enum(roles), disabled: z.boolean() });
export const invited = z.object({ id, invited: z.literal(true) });

export const lists = {
  vessels: pagedList(vessel),
  materials: pagedList(material),
  tests: pagedList(testRow),
  logs: list(logRow),
  reductions: list(reductionRow),
  notes: list(noteRow),
  shareLinks: list(shareLinkRow),
  audit: z.object({ items: z.array(auditEvent), ...page }),
  tokens: list(apiTokenRow),
  users: list(userRow),
};

export const testRenamed = z.object({ id, name: z.string() });
export const planSaved = z.object({ id, saved: z.literal(true) });
export const sent = z.object({ sent: z.literal(true) });
export const accepted = z.object({ accepted: z.literal(true) });
export const passwordSet = z.object({ email: z.string() });
