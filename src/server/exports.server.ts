// Binds the pure export renderers (src/server/reports) to a test's record.
import type { ReportInput } from './reports/report-input';
import { renderSummaryCsv } from './reports/csv';
import { renderReportPdf } from './reports/pdf';
import { AppError } from './errors';
import { cachedReportPdf } from './report-cache.server';
import { recordVersion } from './reports/record-version';
import type { TestRecord } from './record.server';
import { procedureFacts } from '../lib/signing';

/**
 * The renderers' input for a record with a finished reduction (409 without one). Through a
 * share link (`forInspector`) the signers' e-mail addresses are left out.
 */
export function buildReportInput(r: TestRecord, now = new Date(), forInspector = false): ReportInput {
  if (!r.result || !r.reduction || !r.plan)
    throw new AppError('no-result', 'There is nothing to export yet: the test has no finished reduction.');
  const plan = r.plan;
  const dispositions: ReportInput['dispositions'] = {};
  const ids = new Set(r.result.gauges.map((g) => g.id));
  for (const d of r.dispositions) {
    if (ids.has(d.gaugeId)) dispositions[d.gaugeId] = { outcome: d.outcome, reason: d.reason, by: d.by, at: d.at };
    else
      for (const g of r.result.gauges)
        if (g.id.startsWith(`${d.gaugeId}/`) && !dispositions[g.id])
          dispositions[g.id] = { outcome: d.outcome, reason: d.reason, by: d.by, at: d.at };
  }
  return {
    generatedAt: now,
    draft: r.test.status !== 'released',
    test: { id: r.test.id, name: r.test.name, status: r.test.status },
    vessel: {
      tag: r.vessel.tag,
      name: r.vessel.name,
      shape: plan.vessel.shape,
      ends: plan.vessel.ends,
      insideDiameter: plan.vessel.insideDiameter,
      wallThickness: plan.vessel.wallThickness,
      length: plan.vessel.length,
    },
    material: {
      name: plan.material.name ?? r.material?.name ?? 'material',
      elasticModulus: plan.material.elasticModulus,
      poissonRatio: plan.material.poissonRatio,
      yieldStrength: plan.material.yieldStrength,
    },
    units: plan.units,
    model: r.result.model,
    testPressure: plan.testPressure,
    procedure: procedureFacts(plan),
    tolerances: plan.tolerances,
    reductionId: r.reduction.id,
    engineVersion: r.result.engineVersion,
    logs: r.reducedLogs.map((l) => ({ filename: l.filename, sha256: l.sha256, rows: l.rows })),
    result: r.result,
    dispositions,
    gaugeOutcomes: Object.fromEntries(r.gauges.map((g) => [g.id, g.outcome])),
    verdict: r.verdict ?? r.result.verdict,
    signatures: r.signatures
      .filter((s) => s.reductionId === r.reduction!.id)
      .map((s) => ({
        kind: s.kind,
        name: s.name,
        email: forInspector ? '' : s.email,
        at: s.createdAt,
        reductionId: s.reductionId,
        statement: s.statement,
      })),
  };
}

const fileStem = (r: TestRecord) => `hoopline-test-${r.test.id}-${r.test.status === 'released' ? 'released' : 'draft'}`;

export function csvResponse(r: TestRecord, forInspector = false): Response {
  const body = renderSummaryCsv(buildReportInput(r, new Date(), forInspector));
  return new Response(body, {
    headers: {
      'content-type': 'text/csv; charset=utf-8',
      'content-disposition': `attachment; filename="${fileStem(r)}.csv"`,
      'cache-control': 'no-store',
    },
  });
}

/**
 * The PDF, rendered once per record version (report-cache.server.ts); 304 when the reader has it.
 * Through a share link (`forInspector`) the input leaves out e-mail addresses, so its version differs.
 */
export async function pdfResponse(r: TestRecord, request?: Request, forInspector = false): Promise<Response> {
  const input = buildReportInput(r, new Date(), forInspector);
  const version = recordVersion(input);
  const headers = {
    etag: `"report-${version}"`,
    'x-record-version': version,
    'cache-control': 'private, no-cache',
  };
  if (request?.headers.get('if-none-match')?.includes(headers.etag))
    return new Response(null, { status: 304, headers });
  const pdf = await cachedReportPdf(r.test.id, version, () => renderReportPdf(input));
  return new Response(new Uint8Array(pdf), {
    headers: {
      ...headers,
      'content-type': 'application/pdf',
      'content-disposition': `inline; filename="${fileStem(r)}.pdf"`,
    },
  });
}
