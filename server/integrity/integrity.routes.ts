import { pipeline } from 'node:stream/promises';
import { Router, type Response } from 'express';
import type { AnalysisResult } from '@shared/analysis';
import { exportFormatSchema, reverificationRequestSchema, type ExportFormat, type RunReportDto } from '@shared/api';
import type { AuditTrail } from '../audit/audit-trail';
import type { Guards } from '../auth/passport';
import { HttpError } from '../http/http-error';
import { idParameter } from '../http/id-parameter';
import { validateBody } from '../http/validate-body';
import { blocksCsv, countsCsv } from '../reports/run-csv';
import { buildRunReport, type RunReportDeps } from '../reports/run-report';
import type { ReverificationsService } from './reverifications.service';
import type { VerificationService } from './verification.service';

/** File names of the exports: from the run id only. */
const EXPORT_FILE: Record<ExportFormat, (runId: number) => string> = {
  json: (runId) => `bellkeep-run-${runId}.json`,
  pdf: (runId) => `bellkeep-run-${runId}.pdf`,
  'counts.csv': (runId) => `bellkeep-run-${runId}-counts.csv`,
  'blocks.csv': (runId) => `bellkeep-run-${runId}-blocks.csv`,
};

/**
 * `/api/runs/:id/...` for auditing: the integrity check, re-verifications (auditors and admins
 * ask for them; everyone signed in reads them) and the exports, each recorded in the trail.
 */
export function runIntegrityRoutes(
  deps: RunReportDeps & { verification: VerificationService; reverifications: ReverificationsService; audit: AuditTrail; guards: Guards },
): Router {
  const { verification, reverifications, audit, guards } = deps;
  const router = Router();

  router.get('/:id/verification', guards.requireSignIn, async (request, response) => {
    response.json(await verification.verify(idParameter(request, 'run')));
  });

  router.get('/:id/reverifications', guards.requireSignIn, async (request, response) => {
    response.json(await reverifications.list(idParameter(request, 'run')));
  });

  router.post('/:id/reverifications', guards.requireRole('auditor', 'admin'), validateBody(reverificationRequestSchema), async (request, response) => {
    const { seed } = request.body;
    if (seed !== undefined && !request.user!.roles.includes('admin')) {
      throw HttpError.forbidden('Only an admin re-analyses a log with another seed; an auditor re-verifies it as recorded.');
    }
    response.status(201).json(await reverifications.request(idParameter(request, 'run'), request.user!.id, seed?.toLowerCase()));
  });

  router.get('/:id/export/:format', guards.requireSignIn, async (request, response) => {
    const runId = idParameter(request, 'run');
    const format = exportFormatSchema.safeParse(request.params['format']);
    if (!format.success) throw HttpError.badRequest(`The export format ${JSON.stringify(request.params['format'])} ${format.error.issues[0].message}.`, 'format');
    const report = await buildRunReport(runId, request.user!.name, deps);
    await audit.record({
      actorId: request.user!.id,
      action: 'run.exported',
      targetType: 'run',
      targetId: runId,
      details: { format: format.data, fingerprint: report.result.fingerprint },
    });
    response.attachment(EXPORT_FILE[format.data](runId));
    await sendExport(format.data, report, response);
  });

  return router;
}

async function sendExport(format: ExportFormat, report: RunReportDto, response: Response): Promise<void> {
  const result: AnalysisResult = report.result;
  if (format === 'json') response.type('application/json').send(`${JSON.stringify(report, null, 2)}\n`);
  else if (format === 'counts.csv') response.type('text/csv').send(countsCsv(result));
  else if (format === 'blocks.csv') response.type('text/csv').send(blocksCsv(result));
  else {
    // Loaded on the first PDF: pdfkit and its font engine are heavy, and most starts never need them.
    const { createPdfReport } = await import('../reports/pdf-report');
    response.type('application/pdf');
    await pipeline(createPdfReport(report), response);
  }
}
