import { RECORD_KIND_KEYS, RECORD_KIND_PATHS, RECORD_KINDS_WITH_FORMS, recordListQuerySchema, type RecordFormKind } from '../../shared/schemas/records';
import { idempotency } from '../middleware/idempotency';
import { userOf } from '../middleware/session';
import { body, query } from '../middleware/validate';
import * as records from '../services/records';
import { idParam, type RouteDef, type RouteFactory } from './route';

/**
 * Per kind (RECORD_KIND_PATHS gives the segment):
 *   POST/GET /api/hives/:hiveId/<segment>   (Forage checks: /api/apiaries/:apiaryId/forage-checks)
 *   GET/PATCH/DELETE /api/<segment>/:recordId
 * A single record answers `{ <RECORD_KIND_KEYS[kind]>: dto }`, a list `{ records: [...] }`,
 * a delete 204. Creates honour the Idempotency-Key header.
 */
export const recordRoutes: RouteFactory = (ctx) => {
  const schemas = records.schemasOf(ctx);
  const idem = idempotency(ctx);
  return RECORD_KINDS_WITH_FORMS.flatMap((kind) => kindRoutes(kind));

  function kindRoutes(kind: RecordFormKind): RouteDef[] {
    const seg = RECORD_KIND_PATHS[kind];
    const key = RECORD_KIND_KEYS[kind];
    const parent = records.RECORD_KINDS_TABLE[kind].scope === 'hive' ? 'hiveId' : 'apiaryId';
    const base = parent === 'hiveId' ? `/api/hives/:hiveId/${seg}` : `/api/apiaries/:apiaryId/${seg}`;
    const one = `/api/${seg}/:recordId`;
    return [
      {
        method: 'post',
        path: base,
        auth: true,
        before: [idem],
        handler: async (req, res) => {
          const parentId = idParam(req, parent);
          const input = body(req, schemas[kind].create);
          res.status(201).json({ [key]: await records.createRecord(ctx, userOf(req), kind, parentId, input as never) });
        },
      },
      {
        method: 'get',
        path: base,
        auth: true,
        handler: async (req, res) => {
          const parentId = idParam(req, parent);
          res.json({ records: await records.listRecords(ctx, userOf(req), kind, parentId, query(req, recordListQuerySchema)) });
        },
      },
      {
        method: 'get',
        path: one,
        auth: true,
        handler: async (req, res) => {
          res.json({ [key]: await records.getRecord(ctx, userOf(req), kind, idParam(req, 'recordId')) });
        },
      },
      {
        method: 'patch',
        path: one,
        auth: true,
        handler: async (req, res) => {
          const recordId = idParam(req, 'recordId');
          res.json({ [key]: await records.updateRecord(ctx, userOf(req), kind, recordId, body(req, schemas[kind].update)) });
        },
      },
      {
        method: 'delete',
        path: one,
        auth: true,
        handler: async (req, res) => {
          await records.deleteRecord(ctx, userOf(req), kind, idParam(req, 'recordId'));
          res.status(204).end();
        },
      },
    ];
  }
};
