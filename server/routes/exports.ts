/**
 * Exports a keeper can keep, and the import that restores an account export.
 *
 *   GET  /api/apiaries/:apiaryId/treatments.csv?season=YYYY   (export:read) veterinary medicine record, CSV attachment
 *   GET  /api/apiaries/:apiaryId/records.csv?season=YYYY      (export:read) the season's records, CSV attachment
 *   GET  /api/export                                           every apiary the person owns, JSON attachment
 *        { format: 'frameside-export', version: 1, exportedAt, account, notes, users, tables }
 *   POST /api/import   body: an export (application/json, up to 50 MB) → 201 { result: ImportResult }
 *        into an account that owns nothing yet (409 otherwise); one transaction.
 */
import express, { type Response } from 'express';
import { exportSeasonQuerySchema } from '../../shared/schemas/exports';
import { jsonGuard } from '../middleware/json-guard';
import { userOf } from '../middleware/session';
import { query } from '../middleware/validate';
import * as exportsService from '../services/exports';
import { idParam, type RouteFactory } from './route';

function sendCsv(res: Response, file: exportsService.CsvFile) {
  res.setHeader('Content-Type', 'text/csv; charset=utf-8');
  res.setHeader('Content-Disposition', `attachment; filename="${file.fileName}"`);
  res.setHeader('Cache-Control', 'no-store');
  res.send(file.body);
}

export const exportRoutes: RouteFactory = (ctx) => [
  {
    method: 'get',
    path: '/api/apiaries/:apiaryId/treatments.csv',
    auth: true,
    handler: async (req, res) => {
      const apiaryId = idParam(req, 'apiaryId');
      sendCsv(res, await exportsService.treatmentsCsv(ctx, userOf(req), apiaryId, query(req, exportSeasonQuerySchema).season));
    },
  },
  {
    method: 'get',
    path: '/api/apiaries/:apiaryId/records.csv',
    auth: true,
    handler: async (req, res) => {
      const apiaryId = idParam(req, 'apiaryId');
      sendCsv(res, await exportsService.recordsCsv(ctx, userOf(req), apiaryId, query(req, exportSeasonQuerySchema).season));
    },
  },
  {
    method: 'get',
    path: '/api/export',
    auth: true,
    handler: async (req, res) => {
      const data = await exportsService.exportAccount(ctx, userOf(req));
      res.setHeader('Content-Disposition', `attachment; filename="frameside-export-${data.exportedAt.slice(0, 10)}.json"`);
      res.setHeader('Cache-Control', 'no-store');
      res.json(data);
    },
  },
  {
    method: 'post',
    path: '/api/import',
    auth: true,
    // Read here, after the sign-in check (createApp leaves this path to its route).
    before: [express.json({ limit: '50mb' }), jsonGuard],
    handler: async (req, res) => {
      res.status(201).json({ result: await exportsService.importAccount(ctx, userOf(req), req.body) });
    },
  },
];
