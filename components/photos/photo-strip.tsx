import { useState } from 'react';
import { Image, Pressable, View } from 'react-native';
import { photoUrl } from '@/components/api/photos';
import { useTheme } from '@/components/theme/use-theme';
import { Text } from '@/components/ui/text';
import type { PhotoStatus } from '@/shared/domain/photos';
import { PhotoViewer, type ViewablePhoto } from './photo-viewer';

export interface StripPhoto extends ViewablePhoto {
  status?: PhotoStatus;
  failureReason?: string | null;
}

interface Props {
  photos: StripPhoto[];
  /** Names the test ids: `<testID>-<photo id>`. */
  testID?: string;
  subtitle?: string;
  /** Given when this person may delete the photo. */
  onDelete?: (photo: ViewablePhoto) => void;
  mayDelete?: (photo: StripPhoto) => boolean;
}

const TILE_W = 120;
const TILE_H = 90;

/**
 * A row of thumbnails (wrapping), each a gloved-finger target with its frame label written
 * under it. Tap one to see it large, then step through the others; photos still processing
 * show as such, and failed ones say why.
 */
export function PhotoStrip({ photos, testID = 'photo-thumb', subtitle, onDelete, mayDelete }: Props) {
  const t = useTheme();
  const ready = photos.filter((p) => (p.status ?? 'ready') === 'ready');
  const [open, setOpen] = useState<number | null>(null);
  const current = open !== null ? ready[open] : undefined;

  return (
    <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: t.targetGap }}>
      {photos.map((p) => {
        const status = p.status ?? 'ready';
        if (status !== 'ready') {
          return (
            <View
              key={p.id}
              testID={`${testID}-${p.id}`}
              accessibilityLabel={`${p.label}: ${status === 'processing' ? 'processing' : 'could not be processed'}`}
              style={{
                width: TILE_W,
                gap: t.space.xxs,
              }}
            >
              <View
                style={{
                  width: TILE_W,
                  height: TILE_H,
                  borderRadius: t.radius.sm,
                  borderWidth: t.borderWidth.thin,
                  borderStyle: 'dashed',
                  borderColor: status === 'failed' ? t.colours.red : t.colours.line,
                  backgroundColor: status === 'failed' ? t.colours.redTint : t.colours.sunk,
                  alignItems: 'center',
                  justifyContent: 'center',
                  padding: t.space.xxs,
                }}
              >
                <Text variant="small" tone={status === 'failed' ? 'warning' : 'muted'} style={{ textAlign: 'center' }}>
                  {status === 'processing' ? 'Processing…' : 'Not processed'}
                </Text>
              </View>
              <Text variant="small">{p.label}</Text>
              {status === 'failed' && p.failureReason ? (
                <Text variant="small" tone="warning">
                  {p.failureReason}
                </Text>
              ) : null}
            </View>
          );
        }
        const at = ready.indexOf(p);
        return (
          <Pressable
            key={p.id}
            testID={`${testID}-${p.id}`}
            accessibilityRole="imagebutton"
            accessibilityLabel={`${p.label}. Open large`}
            onPress={() => setOpen(at)}
            style={({ pressed }) => ({ width: TILE_W, gap: t.space.xxs, opacity: pressed ? 0.8 : 1 })}
          >
            <Image
              source={{ uri: photoUrl(p.id, 'thumb') }}
              accessibilityLabel={p.label}
              alt={p.label}
              resizeMode="cover"
              style={{ width: TILE_W, height: TILE_H, borderRadius: t.radius.sm, borderWidth: t.borderWidth.thin, borderColor: t.colours.line, backgroundColor: t.colours.sunk }}
            />
            <Text variant="small">{p.label}</Text>
          </Pressable>
        );
      })}
      <PhotoViewer
        photos={ready}
        index={open}
        onIndex={setOpen}
        subtitle={subtitle}
        onDelete={onDelete && current && (mayDelete?.(current) ?? true) ? onDelete : undefined}
      />
    </View>
  );
}
