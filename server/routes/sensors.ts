/**
 * Hive-logger readings.
 *
 *   POST /api/hives/:hiveId/sensor-imports?fileName=&timeColumn=&temperatureColumn=&weightColumn=
 *        &timeFormat=iso|dmy|mdy|epoch-s|epoch-ms&temperatureUnit=C|F&weightUnit=kg|lb&timeZone=&delimiter=
 *        body: the raw CSV file, Content-Type text/csv, at most 20 MB        (record:create:sensor)
 *        → 201 { import: SensorImportResult }  ("N new, M already there"; bad rows with line numbers)
 *   GET  /api/hives/:hiveId/sensor-readings?from=&to=&points=              (hive:read)
 *        → { series: SensorSeries }  averaged into time buckets, at most `points` of them
 */
import express from 'express';
import { SENSOR_CSV_MAX_BYTES, sensorImportQuerySchema, sensorReadingsQuerySchema } from '../../shared/schemas/sensors';
import { AppError } from '../errors';
import { userOf } from '../middleware/session';
import { query } from '../middleware/validate';
import * as sensors from '../services/sensors';
import { idParam, type RouteFactory } from './route';

const CSV_TYPES = ['text/csv', 'text/plain', 'application/csv', 'text/comma-separated-values', 'text/tab-separated-values'];

const csvBody = express.text({ type: CSV_TYPES, limit: SENSOR_CSV_MAX_BYTES, defaultCharset: 'utf-8' });

export const sensorRoutes: RouteFactory = (ctx) => [
  {
    method: 'post',
    path: '/api/hives/:hiveId/sensor-imports',
    auth: true,
    before: [csvBody],
    handler: async (req, res) => {
      const hiveId = idParam(req, 'hiveId');
      const q = query(req, sensorImportQuerySchema);
      if (typeof req.body !== 'string') {
        throw new AppError('unsupported', 'Send the logger file itself as CSV text (Content-Type: text/csv).', 415);
      }
      res.status(201).json({ import: await sensors.importSensorCsv(ctx, userOf(req), hiveId, q, req.body) });
    },
  },
  {
    method: 'get',
    path: '/api/hives/:hiveId/sensor-readings',
    auth: true,
    handler: async (req, res) => {
      const hiveId = idParam(req, 'hiveId');
      res.json({ series: await sensors.listSensorReadings(ctx, userOf(req), hiveId, query(req, sensorReadingsQuerySchema)) });
    },
  },
];
