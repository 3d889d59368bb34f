import { useEffect, useState } from 'react';
import { Image, Modal, View } from 'react-native';
import { photoUrl } from '@/components/api/photos';
import { useBreakpoints } from '@/components/layout/use-breakpoints';
import { useTheme } from '@/components/theme/use-theme';
import { BigButton } from '@/components/ui/big-button';
import { ChevronLeftIcon, ChevronRightIcon, CrossIcon } from '@/components/ui/icons';
import { Text } from '@/components/ui/text';

export interface ViewablePhoto {
  id: string;
  /** "Box 2, frame 5": the caption and the image's alt text. */
  label: string;
}

interface Props {
  photos: ViewablePhoto[];
  /** Index of the photo shown, or null when closed. */
  index: number | null;
  onIndex: (index: number | null) => void;
  /** When given, a Delete button (tapped twice: once to ask, once to delete). */
  onDelete?: (photo: ViewablePhoto) => void;
  /** Words under the caption, e.g. the date of the check. */
  subtitle?: string;
}

/**
 * One photo large, on the ink background (glare-proof, and the photo's own colours read true),
 * with Previous / Next along the bottom in thumb reach and the arrow keys on a desk.
 */
export function PhotoViewer({ photos, index, onIndex, onDelete, subtitle }: Props) {
  const t = useTheme();
  const { isWide } = useBreakpoints();
  const [confirming, setConfirming] = useState(false);
  const open = index !== null && photos.length > 0;
  const i = open ? Math.min(index, photos.length - 1) : 0;
  const photo = open ? photos[i] : undefined;
  const hasPrev = i > 0;
  const hasNext = i < photos.length - 1;

  useEffect(() => setConfirming(false), [photo?.id]);

  useEffect(() => {
    if (!open || typeof document === 'undefined') return;
    const onKey = (e: KeyboardEvent) => {
      if (e.key === 'Escape') onIndex(null);
      else if (e.key === 'ArrowLeft' && i > 0) onIndex(i - 1);
      else if (e.key === 'ArrowRight' && i < photos.length - 1) onIndex(i + 1);
    };
    document.addEventListener('keydown', onKey);
    return () => document.removeEventListener('keydown', onKey);
  }, [open, i, photos.length, onIndex]);

  if (!photo) return null;
  const deleteButton = onDelete ? (
    <BigButton
      testID="photo-viewer-delete"
      variant={confirming ? 'danger' : 'secondary'}
      label={confirming ? 'Tap again to delete' : 'Delete photo'}
      onPress={() => {
        if (!confirming) return setConfirming(true);
        onDelete(photo);
        onIndex(photos.length > 1 ? Math.max(0, i - (hasNext ? 0 : 1)) : null);
      }}
    />
  ) : null;
  return (
    <Modal visible transparent={false} animationType="none" onRequestClose={() => onIndex(null)}>
      <View testID="photo-viewer" style={{ flex: 1, backgroundColor: t.colours.ink, padding: t.space.md, gap: t.space.md }}>
        <View style={{ flexDirection: 'row', alignItems: 'center', gap: t.space.sm }}>
          <View style={{ flex: 1 }}>
            <Text variant="heading" tone="onInk" testID="photo-viewer-label">
              {photo.label}
            </Text>
            <Text tone="onInk" testID="photo-viewer-position">
              {`Photo ${i + 1} of ${photos.length}${subtitle ? ` · ${subtitle}` : ''}`}
            </Text>
          </View>
          <BigButton testID="photo-viewer-close" variant="secondary" label="Close" icon={(c) => <CrossIcon colour={c} />} onPress={() => onIndex(null)} />
        </View>
        <View style={{ flex: 1, minHeight: 200 }}>
          <Image
            testID="photo-viewer-image"
            source={{ uri: photoUrl(photo.id, 'display') }}
            accessibilityLabel={photo.label}
            alt={photo.label}
            resizeMode="contain"
            style={{ flex: 1, width: '100%', height: '100%' }}
          />
        </View>
        {deleteButton && !isWide ? <View style={{ flexDirection: 'row', justifyContent: 'flex-end' }}>{deleteButton}</View> : null}
        <View style={{ flexDirection: 'row', gap: t.targetGap, justifyContent: 'center' }}>
          <BigButton
            testID="photo-viewer-prev"
            variant="secondary"
            label="Previous"
            accessibilityLabel={hasPrev ? `Previous photo: ${photos[i - 1]!.label}` : 'Previous photo'}
            icon={(c) => <ChevronLeftIcon colour={c} />}
            disabled={!hasPrev}
            onPress={() => onIndex(i - 1)}
            style={isWide ? { minWidth: 200 } : { flex: 1 }}
          />
          {isWide ? deleteButton : null}
          <BigButton
            testID="photo-viewer-next"
            variant="secondary"
            label="Next"
            accessibilityLabel={hasNext ? `Next photo: ${photos[i + 1]!.label}` : 'Next photo'}
            icon={(c) => <ChevronRightIcon colour={c} />}
            disabled={!hasNext}
            onPress={() => onIndex(i + 1)}
            style={isWide ? { minWidth: 200 } : { flex: 1 }}
          />
        </View>
      </View>
    </Modal>
  );
}
