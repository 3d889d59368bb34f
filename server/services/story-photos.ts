/**
 * The one place the Hive story picks up photos. Until a `photos` table exists every item has
 * none. The photos engineer fills this in: one query for all the items' photos (e.g.
 * `where record_id = any($ids)`), grouped by record id, never a query per item.
 */
import type { StoryItemDto } from '../../shared/schemas/story';
import type { Ctx } from '../context';

export async function attachPhotos(_ctx: Ctx, items: StoryItemDto[]): Promise<StoryItemDto[]> {
  return items;
}
