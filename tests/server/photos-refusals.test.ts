/**
 * Bad uploads: each is refused with a clear 4xx and leaves nothing stored — no row, no file.
 * The limits are Frameside's own (shared/domain/photos.ts); the file formats are checked against
 * their specifications: JPEG (ITU-T T.81 / ISO 10918-1: SOI FF D8, SOS FF DA, EOI FF D9) and
 * PNG (W3C PNG specification: 8-byte signature, IHDR width/height, IEND chunk).
 */
import { PHOTO_LIMITS } from '../../shared/domain/photos';
import { inspections } from '../../db/schema';
import { makeJpeg, pngClaiming } from '../helpers/images';
import { startDemoServer, type DemoServer } from '../helpers/server';
import { photoRowCount, storedFiles, upload } from '../helpers/photo-upload';

describe('photo uploads that are refused', () => {
  let s: DemoServer;
  let ash: string;
  let jpeg: Buffer;

  beforeAll(async () => {
    s = await startDemoServer();
    ash = s.ids.hives.Ash!;
    jpeg = makeJpeg(64, 48);
  });
  afterAll(() => s.close());

  const expectNothingStored = async () => {
    expect(await photoRowCount(s)).toBe(0);
    expect(storedFiles(s.uploadsDir)).toEqual([]);
  };

  it('refuses a text file named .jpg (400) — the bytes decide, not the name or declared type', async () => {
    const res = await upload(s.as.keeper, ash, [{ buf: Buffer.from('Queen seen, 8 frames of brood.\n'.repeat(20)), name: 'notes.jpg', type: 'image/jpeg' }]);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('not_a_photo');
    expect(res.body.error.message).toMatch(/not a picture Frameside can read/);
    await expectNothingStored();
  });

  it('refuses a truncated JPEG (400): no end-of-image marker after the scan starts (ISO 10918-1)', async () => {
    const res = await upload(s.as.keeper, ash, [{ buf: jpeg.subarray(0, Math.floor(jpeg.length * 0.6)), name: 'cut.jpg' }]);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('photo_cut_off');
    expect(res.body.error.message).toMatch(/cut off/);
    await expectNothingStored();
  });

  it('refuses a PNG claiming 30000 × 30000 px from its header, quickly and without decoding it', async () => {
    const bomb = pngClaiming(30000, 30000);
    expect(bomb.length).toBeLessThan(2000);
    const started = Date.now();
    const res = await upload(s.as.keeper, ash, [{ buf: bomb, name: 'big.png', type: 'image/png' }]);
    const ms = Date.now() - started;
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('photo_too_many_pixels');
    expect(res.body.error.message).toMatch(/30000 × 30000 pixels/);
    // Decoding 900 megapixels would take minutes and gigabytes; reading the header takes milliseconds.
    expect(ms).toBeLessThan(1000);
    await expectNothingStored();
  });

  it(`refuses a file over ${PHOTO_LIMITS.maxBytes / 1024 / 1024} MB (413) and removes the part already written`, async () => {
    const big = Buffer.concat([jpeg.subarray(0, 100), Buffer.alloc(PHOTO_LIMITS.maxBytes + 1024 - 100, 0x20)]);
    const res = await upload(s.as.keeper, ash, [{ buf: big, name: 'huge.jpg' }]);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('photo_too_large');
    expect(res.body.error.message).toMatch(/larger than 15 MB/);
    await expectNothingStored();
  });

  it(`refuses more than ${PHOTO_LIMITS.maxFiles} files in one upload (400)`, async () => {
    const files = Array.from({ length: PHOTO_LIMITS.maxFiles + 1 }, (_, i) => ({ buf: jpeg, name: `f${i}.jpg` }));
    const res = await upload(s.as.keeper, ash, files);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('too_many_photos');
    expect(res.body.error.message).toMatch(/at most 6 photos/);
    await expectNothingStored();
  });

  it('refuses the whole upload when one of several files is not a photo, and keeps none of them', async () => {
    const res = await upload(s.as.keeper, ash, [
      { buf: jpeg, name: 'a.jpg' },
      { buf: Buffer.from('%PDF-1.7 not a photo'), name: 'b.jpg' },
    ]);
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/^Photo 2 of 2 is not a picture/);
    await expectNothingStored();
  });

  it('refuses an upload with no file, a file in another field, or odd details (400)', async () => {
    const none = await s.as.keeper.post(`/api/hives/${ash}/photos`).field('box', '1');
    expect(none.status).toBe(400);
    expect(none.body.error.message).toBe('Choose at least one photo to add.');
    const json = await s.as.keeper.post(`/api/hives/${ash}/photos`).send({ photos: 'x' });
    expect(json.status).toBe(400);
    const other = await s.as.keeper.post(`/api/hives/${ash}/photos`).attach('picture', jpeg, 'a.jpg');
    expect(other.status).toBe(400);
    expect(other.body.error.message).toMatch(/"photos" field/);
    const cases: [Record<string, string>, RegExp][] = [
      [{ frame: '5' }, /box as well as the frame/],
      [{ box: '9' }, /at most 8/],
      [{ box: '4' }, /This hive has 3 boxes/],
      [{ box: '1', frame: '11' }, /Box 1 holds 10 frames/],
      [{ box: 'two' }, /whole number/],
      [{ colour: 'red' }, /not expected/],
      [{ inspectionId: 'not-a-uuid' }, /id is not valid/],
      [{ box: '1'.repeat(200) }, /not expected or too long/],
    ];
    for (const [fields, message] of cases) {
      const res = await upload(s.as.keeper, ash, [{ buf: jpeg, name: 'a.jpg' }], fields);
      expect({ fields, status: res.status }).toEqual({ fields, status: 400 });
      expect(res.body.error.message).toMatch(message);
    }
    await expectNothingStored();
  });

  it('refuses a Quick check of another hive (400)', async () => {
    const [insp] = await s.testDb.db
      .insert(inspections)
      .values({ hiveId: s.ids.hives.Bramble!, occurredAt: s.clock.now, createdBy: s.ids.users.keeper, framesBrood: 6, framesBees: 10, queenStatus: 'eggs-seen' })
      .returning();
    const res = await upload(s.as.keeper, ash, [{ buf: jpeg, name: 'a.jpg' }], { inspectionId: insp!.id });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.inspectionId).toMatch(/not found for this hive/);
    await expectNothingStored();
  });

  it('turns away uploads to a hive of an apiary the person is not in (404) or may only view (403), before storing a byte', async () => {
    const granite = s.ids.hives.Granite!; // Quarry Hill: the sitter sits Orchard Row only
    const sitter = await upload(s.as.sitter, granite, [{ buf: jpeg, name: 'a.jpg' }]);
    expect(sitter.status).toBe(404);
    const stranger = await upload(s.as.stranger, ash, [{ buf: jpeg, name: 'a.jpg' }]);
    expect(stranger.status).toBe(404);
    expect(stranger.body.error.message).toBe('That hive was not found.');
    const mentor = await upload(s.as.mentor, ash, [{ buf: jpeg, name: 'a.jpg' }]);
    expect(mentor.status).toBe(403);
    expect(mentor.body.error.message).toMatch(/viewer/);
    await expectNothingStored();
  });
});
