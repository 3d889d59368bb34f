import { pipeline } from 'node:stream/promises';
import { photoGetQuerySchema, photoListQuerySchema } from '../../shared/schemas/photos';
import { userOf } from '../middleware/session';
import { beforeBody, incomingObjects, photoUpload } from '../middleware/upload';
import { query } from '../middleware/validate';
import * as photos from '../services/photos';
import { resumePhotoProcessing } from '../services/photo-processing';
import { idParam, type RouteFactory } from './route';

export const photoRoutes: RouteFactory = (ctx) => {
  // Photos a stopped server left half-way are picked up again once the app is up.
  setImmediate(() => void resumePhotoProcessing(ctx).catch((err) => ctx.logger.warn({ err }, 'could not resume photo processing')));
  return [
    {
      method: 'post',
      path: '/api/hives/:hiveId/photos',
      auth: true,
      before: [
        beforeBody((req) => photos.assertMayAddPhotos(ctx, userOf(req), idParam(req, 'hiveId'))),
        photoUpload(ctx.storage),
      ],
      handler: async (req, res) => {
        const added = await photos.addPhotos(ctx, userOf(req), idParam(req, 'hiveId'), req.body, incomingObjects(req));
        res.status(202).json({ photos: added });
      },
    },
    {
      method: 'get',
      path: '/api/hives/:hiveId/photos',
      auth: true,
      handler: async (req, res) => {
        const q = query(req, photoListQuerySchema);
        res.setHeader('Cache-Control', 'no-store');
        res.json({ photos: await photos.listPhotos(ctx, userOf(req), idParam(req, 'hiveId'), q) });
      },
    },
    {
      method: 'get',
      path: '/api/photos/:photoId',
      auth: true,
      handler: async (req, res) => {
        const { size } = query(req, photoGetQuerySchema);
        const photo = await photos.openPhoto(ctx, userOf(req), idParam(req, 'photoId'), size);
        res.setHeader('Content-Type', photo.contentType);
        // Private: only this person's browser may keep it, and not for long (access can end).
        res.setHeader('Cache-Control', 'private, max-age=3600');
        res.setHeader('Vary', 'Cookie');
        res.setHeader('X-Content-Type-Options', 'nosniff');
        res.setHeader('Content-Disposition', 'inline');
        res.setHeader('Content-Security-Policy', "default-src 'none'; sandbox");
        await pipeline(photo.stream, res);
      },
    },
    {
      method: 'delete',
      path: '/api/photos/:photoId',
      auth: true,
      handler: async (req, res) => {
        await photos.deletePhoto(ctx, userOf(req), idParam(req, 'photoId'));
        res.status(204).end();
      },
    },
  ];
};
