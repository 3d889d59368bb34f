import * as ImagePicker from 'expo-image-picker';
import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { Image, View } from 'react-native';
import { invalidateHivePhotos } from '@/components/api/photos';
import { useTheme } from '@/components/theme/use-theme';
import { BigButton } from '@/components/ui/big-button';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { Notice } from '@/components/ui/notice';
import { Stepper } from '@/components/ui/stepper';
import { Text } from '@/components/ui/text';
import type { Box } from '@/shared/domain/hives';
import { PHOTO_LIMITS, PHOTO_TYPES } from '@/shared/domain/photos';
import { discardPhoto, onPhotoUploaded, queuePhotos, resumePhotoQueue, retryPhoto, useQueuedPhotos, type QueuedPhoto } from './upload-queue';

export interface PhotoPickerProps {
  hiveId: string;
  /** The hive's boxes, bottom first: the box and frame steppers stop at what the hive holds. */
  boxes: readonly Box[];
  /** Where the photos wait: the Quick check's draft key, or hivePhotosDraftKey(hiveId). */
  draftKey: string;
  /** 'check': sent with the Quick check once it is saved (sendCheckPhotos); 'now': sent at once. */
  sendWith: 'check' | 'now';
  testID?: string;
}

type Target = 'whole' | 'frame';

/** Keeps the hive screen's and the story's lists fresh after each upload, while any picker is mounted. */
export function usePhotoUploadRefresh() {
  const qc = useQueryClient();
  useEffect(() => {
    void resumePhotoQueue();
    return onPhotoUploaded((hiveId) => invalidateHivePhotos(qc, hiveId));
  }, [qc]);
}

/**
 * Frame photos beside the hive: say which frame (box and frame steppers, or the whole check),
 * then take a photo with the phone's camera or choose several from a desk's files. Each waits on
 * the device until it can go, shows its progress while sending, and offers Retry if it failed.
 */
export function PhotoPicker({ hiveId, boxes, draftKey, sendWith, testID = 'photo-picker' }: PhotoPickerProps) {
  const t = useTheme();
  const queued = useQueuedPhotos(draftKey);
  const [target, setTarget] = useState<Target>('whole');
  const [box, setBox] = useState(1);
  const [frame, setFrame] = useState(1);
  const [problem, setProblem] = useState<string | null>(null);
  usePhotoUploadRefresh();

  const boxCount = Math.max(1, boxes.length);
  const framesInBox = boxes[Math.min(box, boxCount) - 1]?.frames ?? 10;
  useEffect(() => {
    if (box > boxCount) setBox(boxCount);
    if (frame > framesInBox) setFrame(framesInBox);
  }, [box, boxCount, frame, framesInBox]);

  const pick = async (camera: boolean) => {
    setProblem(null);
    try {
      const res = camera
        ? await ImagePicker.launchCameraAsync({ mediaTypes: ['images'], quality: 1, exif: false })
        : await ImagePicker.launchImageLibraryAsync({
            mediaTypes: ['images'],
            allowsMultipleSelection: true,
            selectionLimit: PHOTO_LIMITS.maxFiles,
            quality: 1,
            exif: false,
          });
      if (res.canceled || res.assets.length === 0) return;
      const photos = [];
      const refused: string[] = [];
      for (const [i, a] of res.assets.entries()) {
        const blob: Blob = a.file ?? (await (await fetch(a.uri)).blob());
        const type = blob.type || a.mimeType || '';
        if (type && !(PHOTO_TYPES as readonly string[]).includes(type)) refused.push(`${a.fileName ?? `Photo ${i + 1}`} is not a JPEG or PNG photo.`);
        else if (blob.size > PHOTO_LIMITS.maxBytes) refused.push(`${a.fileName ?? `Photo ${i + 1}`} is larger than ${PHOTO_LIMITS.maxBytes / 1024 / 1024} MB.`);
        // The name only helps the browser; the server never uses it.
        else photos.push({ blob, name: `photo-${i + 1}.${type === 'image/png' ? 'png' : 'jpg'}` });
      }
      if (refused.length) setProblem(refused.join(' '));
      if (photos.length) {
        await queuePhotos(
          { draftKey, hiveId, sendWith, box: target === 'frame' ? box : null, frame: target === 'frame' ? frame : null },
          photos,
        );
      }
    } catch (err) {
      setProblem(err instanceof Error && err.message ? `The photo could not be read: ${err.message}` : 'The photo could not be read.');
    }
  };

  const wholeLabel = sendWith === 'check' ? 'Whole check' : 'Whole hive';
  return (
    <View testID={testID} style={{ gap: t.space.md }}>
      <ChoiceChips<Target>
        field="photoTarget"
        label="Photo of"
        options={[
          { value: 'whole', label: wholeLabel },
          { value: 'frame', label: 'One frame' },
        ]}
        value={target}
        onChange={setTarget}
      />
      {target === 'frame' ? (
        <View style={{ gap: t.space.sm }}>
          <Stepper
            field="photoBox"
            label="Box, counted from the bottom"
            value={Math.min(box, boxCount)}
            min={1}
            max={boxCount}
            decreaseLabel="Box below"
            increaseLabel="Box above"
            onChange={setBox}
          />
          <Stepper field="photoFrame" label="Frame" value={Math.min(frame, framesInBox)} min={1} max={framesInBox} decreaseLabel="Previous frame" increaseLabel="Next frame" onChange={setFrame} />
        </View>
      ) : null}
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: t.targetGap }}>
        <BigButton testID={`${testID}-take`} label="Take photo" onPress={() => void pick(true)} style={{ flexGrow: 1 }} />
        <BigButton testID={`${testID}-choose`} variant="secondary" label="Choose photos" onPress={() => void pick(false)} style={{ flexGrow: 1 }} />
      </View>
      <Text tone="muted" variant="small">
        {sendWith === 'check'
          ? 'Photos go with the check when you save it; without signal they wait on this device. Location data is removed on the server.'
          : 'Photos are sent at once; without signal they wait on this device. Location data is removed on the server.'}
      </Text>
      {problem ? (
        <Notice tone="warning" testID={`${testID}-problem`}>
          {problem}
        </Notice>
      ) : null}
      {queued.length > 0 ? (
        <View style={{ gap: t.targetGap }} testID={`${testID}-queue`}>
          {queued.map((q) => (
            <QueuedRow key={q.localId} q={q} testID={`${testID}-queued`} />
          ))}
        </View>
      ) : null}
    </View>
  );
}

const STATE_TEXT: Record<QueuedPhoto['state'], string> = {
  'waiting-check': 'Goes with the check when you save it',
  queued: 'Waiting to send',
  uploading: 'Sending',
  offline: 'No signal: waits on this device and sends itself when the connection is back',
  failed: 'Not sent',
};

function QueuedRow({ q, testID }: { q: QueuedPhoto; testID: string }) {
  const t = useTheme();
  const pct = Math.round(q.progress * 100);
  return (
    <View
      testID={`${testID}-${q.localId}`}
      style={{
        flexDirection: 'row',
        gap: t.space.sm,
        alignItems: 'flex-start',
        padding: t.space.xs,
        borderRadius: t.radius.md,
        borderWidth: t.borderWidth.thin,
        borderColor: q.state === 'failed' ? t.colours.red : t.colours.line,
        backgroundColor: q.state === 'failed' ? t.colours.redTint : t.colours.surface,
      }}
    >
      {q.previewUri ? (
        <Image source={{ uri: q.previewUri }} accessibilityLabel={q.label} alt={q.label} resizeMode="cover" style={{ width: 96, height: 72, borderRadius: t.radius.sm }} />
      ) : null}
      <View style={{ flex: 1, gap: t.space.xxs }}>
        <Text variant="bodyStrong">{q.label}</Text>
        <Text tone={q.state === 'failed' ? 'warning' : 'muted'} testID={`${testID}-state`}>
          {q.state === 'uploading' ? `${STATE_TEXT.uploading} ${pct} %` : STATE_TEXT[q.state]}
        </Text>
        {q.state === 'uploading' ? (
          <View
            role="progressbar"
            aria-label={`Sending ${q.label}`}
            aria-valuemin={0}
            aria-valuemax={100}
            aria-valuenow={pct}
            testID={`${testID}-progress`}
            style={{ height: 12, borderRadius: t.radius.pill, borderWidth: 1, borderColor: t.colours.ink, backgroundColor: t.colours.sunk, overflow: 'hidden' }}
          >
            <View style={{ width: `${pct}%`, height: '100%', backgroundColor: t.colours.green }} />
          </View>
        ) : null}
        {q.error && q.state === 'failed' ? <Text tone="warning">{q.error}</Text> : null}
        {q.state !== 'uploading' ? (
          <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: t.targetGap }}>
            {q.state === 'failed' || q.state === 'offline' ? (
              <BigButton testID={`${testID}-retry`} variant="secondary" label="Retry" onPress={() => retryPhoto(q.localId)} />
            ) : null}
            <BigButton testID={`${testID}-remove`} variant="secondary" label="Remove" accessibilityLabel={`Remove ${q.label}`} onPress={() => void discardPhoto(q.localId)} />
          </View>
        ) : null}
      </View>
    </View>
  );
}
