import type { Response } from 'express';
import type { ExportJobDto, ExportSummaryDto } from '@shared/api';
import {
  bundleRequestSchema,
  conflictExportQuerySchema,
  geojsonExportQuerySchema,
  stakeoutExportQuerySchema,
} from '@shared/schemas/export';
import type { AppConfig } from '../../config';
import { AppError, notFound } from '../../errors';
import { ApiRouter, type RouteMeta } from '../../http/api-router';
import type { FileStorage } from '../../storage/storage';
import { buildBundle } from './bundle';
import { BundleJobs, presentJob } from './bundle-jobs';
import { loadHoleSheet, renderHoleSheets } from '../holes/hole-sheet';
import { TestHole } from '../holes/test-hole.entity';
import { Project } from '../projects/project.entity';
import type { EntityManager } from '@mikro-orm/sqlite';
import type { ConflictExportQuery } from '@shared/schemas/export';
import type { User } from '../users/user.entity';
import { Bore } from '../bores/bore.entity';
import { loadConflictRegister } from '../conflicts/conflict-rows';
import { conflictCsv, conflictList, conflictPdf, conflictXlsx } from './conflict-list';
import { exportFrame, filterNames, loadExportData } from './export-data';
import { exportFileName, isoSeconds } from './export-header';
import { projectGeojson } from './geojson';
import { stakeoutCsv, stakeoutDxf, stakeoutPoints } from './stakeout';

/** Send a file for download (never cached: every export reads the data as it stands). */
function sendFile(res: Response, body: string | Buffer, contentType: string, fileName: string): void {
  res.setHeader('Content-Type', contentType);
  res.setHeader('Content-Disposition', `attachment; filename="${fileName}"`);
  res.setHeader('Cache-Control', 'no-store');
  res.send(typeof body === 'string' ? Buffer.from(body, 'utf8') : body);
}

/**
 * A conflict list as the register holds it (no recompute: the register is rechecked inside every
 * write that can change a clearance, and the header states that check's time). Three queries:
 * the register's two and, when the filter names bores, their names.
 */
async function conflictListFor(em: EntityManager, project: Project, user: Pick<User, 'name'>, query: ConflictExportQuery) {
  const { ids, ...filter } = query;
  const [register, bores] = await Promise.all([
    loadConflictRegister(em, project),
    filter.boreId?.length ? em.find(Bore, { project, id: { $in: filter.boreId } }, { fields: ['id', 'name'] }) : Promise.resolve([]),
  ]);
  const frame = exportFrame(project, user, { basis: 'register', at: register.checkedAt });
  return { frame, ids: ids ?? 'plain', ...conflictList(register, filter, filterNames(register.rows, bores)) };
}

/**
 * Exports for every role (access `export.read`): the conflict list as CSV, XLSX and PDF, the
 * stake-out list as a point file and as DXF, GeoJSON in WGS 84, and the project zip prepared as a
 * job with progress. Conflict lists are the register's rows and state its last check; the
 * report-based files recompute the clearances and state that time; every header gives the CRS,
 * the unit and the vertical datum.
 */
export function exportRoutes(registry: RouteMeta[], config: AppConfig, storage: FileStorage): ApiRouter {
  const api = new ApiRouter('/api/projects/:projectId/exports', registry, config);
  const jobs = new BundleJobs();
  const base = (projectId: number) => `/api/projects/${projectId}/exports`;

  api.get('/', { access: 'export.read' }, async ({ em, project, user }): Promise<ExportSummaryDto> => {
    const data = await loadExportData(em, project, user);
    const points = stakeoutPoints(data);
    return {
      checkedAt: data.computedAt.toISOString(),
      crsCode: data.frame.crsCode,
      crsName: data.frame.crsName,
      unit: data.frame.unit,
      verticalDatum: data.frame.verticalDatum,
      counts: {
        conflicts: data.register.rows.length,
        lines: data.lines.length,
        holes: data.holes.length,
        bores: data.bores.length,
        photos: data.photos.length,
        crossings: points.filter((p) => p.set === 'crossings').length,
        suggested: points.filter((p) => p.set === 'suggested').length,
      },
      holeSheets: 'pdf',
    };
  });

  api.get('/conflicts.csv', { access: 'export.read', query: conflictExportQuerySchema }, async ({ em, project, user, query, res }) => {
    const { frame, rows, info, ids } = await conflictListFor(em, project, user, query);
    sendFile(res, conflictCsv(frame, rows, info, ids), 'text/csv; charset=utf-8', exportFileName(frame, 'conflicts', 'csv'));
  });

  api.get('/conflicts.xlsx', { access: 'export.read', query: conflictExportQuerySchema }, async ({ em, project, user, query, res }) => {
    const { frame, rows, info } = await conflictListFor(em, project, user, query);
    sendFile(res, await conflictXlsx(frame, rows, info), 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet', exportFileName(frame, 'conflicts', 'xlsx'));
  });

  api.get('/conflicts.pdf', { access: 'export.read', query: conflictExportQuerySchema }, async ({ em, project, user, query, res }) => {
    const { frame, rows, info } = await conflictListFor(em, project, user, query);
    sendFile(res, await conflictPdf(frame, rows, info), 'application/pdf', exportFileName(frame, 'conflicts', 'pdf'));
  });

  api.get('/stakeout.csv', { access: 'export.read', query: stakeoutExportQuerySchema }, async ({ em, project, user, query, res }) => {
    const data = await loadExportData(em, project, user);
    const points = stakeoutPoints(data, query);
    sendFile(res, stakeoutCsv(data, points, query), 'text/csv; charset=utf-8', exportFileName(data.frame, 'stakeout-points', 'csv'));
  });

  api.get('/stakeout.dxf', { access: 'export.read', query: stakeoutExportQuerySchema }, async ({ em, project, user, query, res }) => {
    const data = await loadExportData(em, project, user);
    const points = stakeoutPoints(data, query);
    sendFile(res, stakeoutDxf(data, points, query), 'image/vnd.dxf', exportFileName(data.frame, 'stakeout', 'dxf'));
  });

  api.get('/project.geojson', { access: 'export.read', query: geojsonExportQuerySchema }, async ({ em, project, user, query, res }) => {
    const data = await loadExportData(em, project, user);
    sendFile(res, JSON.stringify(projectGeojson(data, query), null, 1), 'application/geo+json', exportFileName(data.frame, 'project', 'geojson'));
  });

  // The zip: POST starts it (the data is read now, the files are made after the answer),
  // GET follows its progress, GET …/download fetches it with its length known.
  api.post('/bundle', { access: 'export.read', body: bundleRequestSchema }, async ({ em, project, user, body, req, status }): Promise<ExportJobDto> => {
    const data = await loadExportData(em, project, user);
    const fileName = exportFileName(data.frame, 'export', 'zip');
    // The sheets are drawn by the test-hole sheet builder while the job runs, reading through an
    // entity manager of the job's own (the request's is done by then).
    const jobEm = em.fork();
    let sheetProject: Project | null = null;
    const sheet = async (holeId: number) => {
      sheetProject ??= await jobEm.findOneOrFail(Project, project.id);
      const hole = await jobEm.findOneOrFail(TestHole, { id: holeId, project: sheetProject }, { populate: ['line', 'bore', 'createdBy'] });
      try {
        return await renderHoleSheets([await loadHoleSheet(jobEm, sheetProject, hole, storage, { report: data.report, checkedAt: data.computedAt })]);
      } catch (err) {
        req.log?.warn({ err, holeId }, 'test-hole sheet for the zip failed; the README lists it');
        throw err;
      }
    };
    const job = jobs.start(
      { projectId: project.id, userId: user.id },
      fileName,
      (report) => buildBundle(data, storage, { filter: body.filter ?? {}, photos: body.photos ?? true, sheet }, report),
      (err) => req.log?.error({ err, checkedAt: isoSeconds(data.computedAt) }, 'export zip failed'),
    );
    status(202);
    return presentJob(job, base(project.id));
  });

  api.get('/bundle/:jobId', { access: 'export.read' }, ({ project, user, params }): ExportJobDto => {
    const job = jobs.get(String(params.jobId), { projectId: project.id, userId: user.id });
    if (!job) throw notFound('Export');
    return presentJob(job, base(project.id));
  });

  api.get('/bundle/:jobId/download', { access: 'export.read' }, ({ project, user, params, res }) => {
    const job = jobs.get(String(params.jobId), { projectId: project.id, userId: user.id });
    if (!job) throw notFound('Export');
    if (job.state === 'failed') throw new AppError(409, 'export_failed', job.error ?? 'The zip could not be made.');
    if (job.state !== 'done' || !job.file) throw new AppError(409, 'export_not_ready', 'The zip is still being prepared. Wait until it is ready.');
    sendFile(res, job.file, 'application/zip', job.fileName);
  });

  return api;
}
