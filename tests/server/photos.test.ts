/**
 * Frame photos through the whole pipeline: upload (202, processing), the image worker, the three
 * stored sizes, serving through the access-checked route, and deleting.
 * Metadata is read back with exifreader 4.46.0 (npm); EXIF tags and orientation values are
 * those of the EXIF 2.3 specification (CIPA DC-008: Orientation 6 = "rotate 90° clockwise to view").
 */
import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import ExifReader from 'exifreader';
import { imageSize } from 'image-size';
import { and, eq } from 'drizzle-orm';
import { auditLog, inspections, photos } from '../../db/schema';
import { makeJpeg, readPixels, withExif } from '../helpers/images';
import { startDemoServer, type DemoServer } from '../helpers/server';
import { binary, photoRowCount, storedFiles, upload, waitForPhoto } from '../helpers/photo-upload';

const SIZES = ['thumb', 'display', 'original'] as const;
jest.setTimeout(30_000);

const KEY_RE = /^photos\/[0-9a-f]{32}\/(original|display|thumb)\.jpg$/;

describe('frame photos', () => {
  let s: DemoServer;
  let ash: string;
  let inspectionId: string;
  let uprightId: string;

  beforeAll(async () => {
    s = await startDemoServer();
    ash = s.ids.hives.Ash!;
    const [insp] = await s.testDb.db
      .insert(inspections)
      .values({ hiveId: ash, occurredAt: s.clock.now, createdBy: s.ids.users.sitter, framesBrood: 7, framesBees: 12, queenStatus: 'eggs-seen' })
      .returning();
    inspectionId = insp!.id;
  });
  afterAll(() => s.close());

  const fetchBytes = async (agent: ReturnType<typeof request.agent>, id: string, size: string) =>
    agent.get(`/api/photos/${id}?size=${size}`).buffer(true).parse(binary);

  it('a sitter adds a phone photo (GPS, orientation 6, hostile file name): 202 processing, then ready, upright, with no metadata left', async () => {
    // 400 × 200, left half red, right half blue, as the sensor stored it; the camera says "turn 90° clockwise".
    const input = withExif(makeJpeg(400, 200), { orientation: 6, gps: true });
    const tagsIn = ExifReader.load(input);
    expect(tagsIn.GPSLatitude).toBeDefined();
    expect(tagsIn.Orientation?.value).toBe(6);

    const res = await upload(s.as.sitter, ash, [{ buf: input, name: '../../etc/passwd.jpg' }], { inspectionId, box: '2', frame: '5' });
    expect(res.status).toBe(202);
    expect(res.body.photos).toHaveLength(1);
    const p = res.body.photos[0];
    expect(p).toMatchObject({ status: 'processing', hiveId: ash, inspectionId, box: 2, frame: 5, label: 'Box 2, frame 5', uploadedBy: { id: s.ids.users.sitter } });
    expect(JSON.stringify(res.body)).not.toMatch(/passwd/);
    uprightId = p.id;

    const ready = await waitForPhoto(s.as.sitter, ash, p.id);
    expect(ready).toMatchObject({ status: 'ready', width: 200, height: 400, failureReason: null });

    // Stored under random keys only; the client's name is used nowhere, and the upload is gone.
    const files = storedFiles(s.uploadsDir);
    expect(files).toHaveLength(3);
    for (const f of files) expect(f.split(path.sep).join('/')).toMatch(KEY_RE);
    expect(fs.existsSync(path.resolve(s.uploadsDir, '../../etc/passwd.jpg'))).toBe(false);
    const [row] = await s.testDb.db.select().from(photos).where(eq(photos.id, p.id));
    expect(row!.uploadKey).toBeNull();

    const expected = { original: [200, 400], display: [200, 400], thumb: [160, 320] };
    for (const size of SIZES) {
      const got = await fetchBytes(s.as.sitter, p.id, size);
      expect(got.status).toBe(200);
      expect(got.headers['content-type']).toBe('image/jpeg');
      expect(got.headers['cache-control']).toBe('private, max-age=3600');
      expect(got.headers['x-content-type-options']).toBe('nosniff');
      expect(got.headers['content-disposition']).toBe('inline');
      const body = got.body as Buffer;
      const dims = imageSize(body);
      expect([size, dims.width, dims.height]).toEqual([size, ...expected[size]]);
      // No EXIF block survives: no GPS, no orientation, no camera make.
      const tags = ExifReader.load(body);
      expect(Object.keys(tags).filter((k) => /GPS|Orientation|Make|Software/.test(k))).toEqual([]);
      expect(body.includes(Buffer.from('Exif\0\0'))).toBe(false);
    }
    // Upright: the red half is now on top, the blue half below.
    const original = path.join(s.uploadsDir, files.find((f) => f.endsWith('original.jpg'))!);
    const px = readPixels(original, [[100, 40], [100, 360]]);
    expect(px.colours[0]![0]).toBeGreaterThan(200);
    expect(px.colours[0]![2]).toBeLessThan(60);
    expect(px.colours[1]![2]).toBeGreaterThan(200);
    expect(px.colours[1]![0]).toBeLessThan(60);
  });

  it('makes a 1600 px display size and a 320 px thumbnail from a larger photo, keeping the original size', async () => {
    s.clock.set(new Date(s.clock.now.getTime() + 60_000)); // listed after the first
    const res = await upload(s.as.keeper, ash, [{ buf: makeJpeg(1800, 900, { gradient: true }), name: 'IMG_0001.JPG' }]);
    expect(res.status).toBe(202);
    const id = res.body.photos[0].id;
    expect(res.body.photos[0].label).toBe('Whole hive');
    const ready = await waitForPhoto(s.as.keeper, ash, id);
    expect(ready).toMatchObject({ status: 'ready', width: 1800, height: 900 });
    const dims = async (size: string) => {
      const r = await fetchBytes(s.as.keeper, id, size);
      const d = imageSize(r.body as Buffer);
      return [d.width, d.height];
    };
    expect(await dims('original')).toEqual([1800, 900]);
    expect(await dims('display')).toEqual([1600, 800]);
    expect(await dims('thumb')).toEqual([320, 160]);
  });

  it('lists a hive’s photos for anyone who may read the hive, optionally one check’s', async () => {
    const all = await s.as.mentor.get(`/api/hives/${ash}/photos`);
    expect(all.status).toBe(200);
    expect(all.body.photos.map((p: { label: string }) => p.label)).toEqual(['Box 2, frame 5', 'Whole hive']);
    expect(all.body.photos[0].uploadedBy.name).toBe('Maren Clough');
    const one = await s.as.mentor.get(`/api/hives/${ash}/photos?inspectionId=${inspectionId}`);
    expect(one.body.photos.map((p: { id: string }) => p.id)).toEqual([uprightId]);
    expect((await s.as.stranger.get(`/api/hives/${ash}/photos`)).status).toBe(404);
    expect((await request(s.app).get(`/api/hives/${ash}/photos`)).status).toBe(401);
    expect((await s.as.mentor.get(`/api/hives/${ash}/photos?inspectionId=nope`)).status).toBe(400);
  });

  it('serves a photo only through the access-checked route: viewer yes, stranger 404, signed out 401, no static path', async () => {
    expect((await fetchBytes(s.as.mentor, uprightId, 'display')).status).toBe(200);
    expect((await s.as.stranger.get(`/api/photos/${uprightId}?size=thumb`)).status).toBe(404);
    expect((await request(s.app).get(`/api/photos/${uprightId}?size=thumb`)).status).toBe(401);
    expect((await s.as.mentor.get(`/api/photos/${uprightId}?size=huge`)).status).toBe(400);
    expect((await s.as.mentor.get(`/api/photos/00000000-0000-4000-8000-000000000000`)).status).toBe(404);
    const [row] = await s.testDb.db.select().from(photos).where(eq(photos.id, uprightId));
    for (const key of [row!.thumbKey!, `uploads/${row!.thumbKey}`]) {
      expect((await s.as.mentor.get(`/${key}`)).status).not.toBe(200);
    }
  });

  it('deletes: not by a viewer or another sitter’s photo, yes by its uploader or a keeper; the stored objects go too', async () => {
    const [keeperPhoto] = await s.testDb.db.select().from(photos).where(eq(photos.uploadedBy, s.ids.users.keeper));
    expect((await s.as.mentor.delete(`/api/photos/${uprightId}`)).status).toBe(403);
    expect((await s.as.sitter.delete(`/api/photos/${keeperPhoto!.id}`)).status).toBe(403);
    expect((await s.as.stranger.delete(`/api/photos/${uprightId}`)).status).toBe(404);

    expect((await s.as.sitter.delete(`/api/photos/${uprightId}`)).status).toBe(204);
    expect((await s.as.sitter.get(`/api/photos/${uprightId}?size=thumb`)).status).toBe(404);
    expect((await s.as.cokeeper.delete(`/api/photos/${keeperPhoto!.id}`)).status).toBe(204);
    expect(await photoRowCount(s)).toBe(0);
    expect(storedFiles(s.uploadsDir)).toEqual([]);

    const trail = await s.testDb.db.select().from(auditLog).where(and(eq(auditLog.entity, 'photo'), eq(auditLog.entityId, uprightId)));
    expect(trail.map((t) => t.action).sort()).toEqual(['create', 'delete']);
    expect(trail.find((t) => t.action === 'create')!.userId).toBe(s.ids.users.sitter);
  });

  it('accepts several photos in one upload, each its own row, all tied to the whole check', async () => {
    const jpeg = makeJpeg(300, 200);
    const res = await upload(s.as.keeper, ash, [1, 2, 3].map((i) => ({ buf: jpeg, name: `p${i}.jpg` })), { inspectionId });
    expect(res.status).toBe(202);
    expect(res.body.photos.map((p: { label: string }) => p.label)).toEqual(['Whole check', 'Whole check', 'Whole check']);
    for (const p of res.body.photos) expect((await waitForPhoto(s.as.keeper, ash, p.id)).status).toBe('ready');
    expect(storedFiles(s.uploadsDir)).toHaveLength(9);

    // The Hive story shows them on the check they belong to, captioned with the frame label.
    const story = await s.as.mentor.get(`/api/hives/${ash}/story`);
    expect(story.status).toBe(200);
    const item = story.body.story.items.find((i: { id: string }) => i.id === inspectionId);
    expect(item.photos.map((p: { id: string }) => p.id)).toEqual(res.body.photos.map((p: { id: string }) => p.id));
    expect(item.photos[0]).toMatchObject({ caption: 'Whole check', url: `/api/photos/${res.body.photos[0].id}?size=display` });
  });
});
