import type { Response, Router } from 'express';
import type { Deps } from '../deps';
import { sendCsv } from '../http/csv';
import { authorize, route } from '../http/routes';
import { idParam } from '../http/validate';
import { buildReport, REPORTS } from './reports.service';

function sendPdf(res: Response, fileName: string, pdf: Buffer): void {
  res.setHeader('Content-Type', 'application/pdf');
  res.setHeader('Content-Disposition', `attachment; filename="${fileName.replace(/[^\w.-]+/g, '_')}"`);
  res.setHeader('Cache-Control', 'private, no-store');
  res.send(pdf);
}

/** Reports of a site's draft or of a revision, as PDF and as CSV (DESIGN §11: the paths are fixed). */
export function registerReportRoutes(router: Router, deps: Deps): void {
  for (const report of REPORTS) {
    route(router, 'get', `/api/v1/sites/:siteId/reports/${report}.pdf`, authorize('site.read'), async (req, res) => {
      const out = await buildReport(deps, req.auth!, idParam(req.params.siteId, 'The site'), report, 'pdf', req.query as Record<string, unknown>);
      sendPdf(res, out.fileName, out.pdf as Buffer);
    });
    route(router, 'get', `/api/v1/sites/:siteId/reports/${report}.csv`, authorize('site.read'), async (req, res) => {
      const out = await buildReport(deps, req.auth!, idParam(req.params.siteId, 'The site'), report, 'csv', req.query as Record<string, unknown>);
      res.setHeader('Cache-Control', 'private, no-store');
      sendCsv(res, out.fileName, out.csv as string);
    });
  }
}
