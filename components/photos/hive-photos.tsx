import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef } from 'react';
import { View } from 'react-native';
import { useHivePhotosQuery, usePhotoDeleteMutation } from '@/components/api/photos';
import { storyRoot } from '@/components/api/story';
import { useMeQuery } from '@/components/api/auth';
import { canIn } from '@/components/apiaries/membership';
import { useNow } from '@/components/layout/use-now';
import { useTheme } from '@/components/theme/use-theme';
import { LoadError } from '@/components/ui/query-state';
import { Section } from '@/components/ui/section';
import { Text } from '@/components/ui/text';
import type { ApiaryDto } from '@/shared/schemas/apiaries';
import type { Box } from '@/shared/domain/hives';
import { PhotoPicker } from './photo-picker';
import { PhotoStrip } from './photo-strip';
import { hivePhotosDraftKey } from './upload-queue';

/**
 * The hive's photos on its page: every photo (from its checks and of the hive itself) as
 * thumbnails, and, for those who may add photos, the picker.
 */
export function HivePhotos({ hiveId, boxes, apiary }: { hiveId: string; boxes: readonly Box[]; apiary: ApiaryDto | undefined }) {
  const t = useTheme();
  const now = useNow();
  const qc = useQueryClient();
  const photos = useHivePhotosQuery(hiveId);
  const session = useMeQuery();
  const del = usePhotoDeleteMutation(hiveId);
  const mayAdd = canIn(apiary, 'record:create:photo', now);
  const mayDeleteOthers = canIn(apiary, 'record:delete-others', now);
  const me = session.data?.user.id;

  // A check's photos show in the Hive story once ready: refresh it when one becomes ready.
  const readyCount = photos.data?.filter((p) => p.status === 'ready').length ?? 0;
  const lastReady = useRef(readyCount);
  useEffect(() => {
    if (readyCount !== lastReady.current) void qc.invalidateQueries({ queryKey: storyRoot(hiveId) });
    lastReady.current = readyCount;
  }, [readyCount, hiveId, qc]);

  const list = photos.data ?? [];
  const byId = new Map(list.map((p) => [p.id, p]));
  return (
    <Section title="Photos" testID="hive-photos">
      {photos.isError ? <LoadError error={photos.error} onRetry={() => void photos.refetch()} /> : null}
      {list.length === 0 && photos.isSuccess ? <Text tone="muted">No photos of this hive yet.</Text> : null}
      {list.length > 0 ? (
        <PhotoStrip
          photos={list}
          onDelete={(p) => del.mutate(p.id)}
          mayDelete={(p) => mayDeleteOthers || byId.get(p.id)?.uploadedBy.id === me}
        />
      ) : null}
      {del.isError ? <LoadError error={del.error} /> : null}
      {mayAdd ? (
        <View style={{ gap: t.space.sm, marginTop: t.space.xs }}>
          <Text variant="heading">Add photos</Text>
          <PhotoPicker hiveId={hiveId} boxes={boxes} draftKey={hivePhotosDraftKey(hiveId)} sendWith="now" testID="hive-photo-picker" />
        </View>
      ) : null}
    </Section>
  );
}
