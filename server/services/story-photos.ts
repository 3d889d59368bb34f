/**
 * The one place the Hive story picks up photos: one query for all the items' photos, grouped
 * by the Quick check they belong to. Only photos that are ready are shown; the URLs go through
 * the access-checked photo route.
 */
import { and, asc, eq, inArray } from 'drizzle-orm';
import { frameLabel } from '../../shared/domain/photos';
import type { StoryItemDto, StoryPhoto } from '../../shared/schemas/story';
import { photos } from '../../db/schema';
import type { Ctx } from '../context';

export async function attachPhotos(ctx: Ctx, items: StoryItemDto[]): Promise<StoryItemDto[]> {
  const ids = items.filter((i) => i.kind === 'inspection').map((i) => i.id);
  if (ids.length === 0) return items;
  const rows = await ctx.db
    .select({ id: photos.id, inspectionId: photos.inspectionId, box: photos.box, frame: photos.frame })
    .from(photos)
    .where(and(inArray(photos.inspectionId, ids), eq(photos.status, 'ready')))
    .orderBy(asc(photos.createdAt), asc(photos.seq));
  if (rows.length === 0) return items;
  const byCheck = new Map<string, StoryPhoto[]>();
  for (const r of rows) {
    const list = byCheck.get(r.inspectionId!) ?? [];
    list.push({ id: r.id, url: `/api/photos/${r.id}?size=display`, caption: frameLabel(r, true) });
    byCheck.set(r.inspectionId!, list);
  }
  return items.map((i) => (i.kind === 'inspection' && byCheck.has(i.id) ? { ...i, photos: byCheck.get(i.id)! } : i));
}
