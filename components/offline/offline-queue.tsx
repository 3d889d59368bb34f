import { onlineManager, useMutationState, useQueryClient } from '@tanstack/react-query';
import { useRouter } from 'expo-router';
import { useEffect, useState, useSyncExternalStore } from 'react';
import { ScrollView, View } from 'react-native';
import { ApiError } from '@/components/api/client';
import { hiveKey } from '@/components/api/hives';
import { apiaryKey } from '@/components/api/apiaries';
import { recordCreateRoot, type RecordCreateVariables } from '@/components/api/records';
import { discardPhoto, retryPhoto, useAllQueuedPhotos, type QueuedPhoto } from '@/components/photos/upload-queue';
import { draftStorageKey } from '@/components/records/use-record-draft';
import { writeLocal } from '@/components/records/local-store';
import { useTheme } from '@/components/theme/use-theme';
import { BigButton } from '@/components/ui/big-button';
import { Text } from '@/components/ui/text';
import { warmOfflineCache } from './warm-cache';
import { SEASON_KIND_LABELS } from '@/shared/domain/season';
import type { RecordFormKind } from '@/shared/schemas/records';

const KIND_LABELS: Record<RecordFormKind, string> = { ...SEASON_KIND_LABELS, 'forage-check': 'Forage check' };

/** The form each kind is recorded with, to reopen a refused record there. */
const FORM_PATHS: Record<RecordFormKind, string> = {
  inspection: '/hives/[hiveId]/check',
  feeding: '/hives/[hiveId]/feeding',
  treatment: '/hives/[hiveId]/treatment',
  'mite-count': '/hives/[hiveId]/mite-count',
  harvest: '/hives/[hiveId]/harvest',
  'queen-event': '/hives/[hiveId]/queen-event',
  'colony-event': '/hives/[hiveId]/colony-event',
  'forage-check': '/apiaries/[apiaryId]/forage-check',
};

interface QueuedRecord {
  id: number;
  state: 'waiting' | 'sending' | 'refused';
  variables: RecordCreateVariables;
  reason: string | null;
  status: number | null;
  submittedAt: number;
}

/** The server's words for a refusal, also from an error restored from the device (a plain object then). */
function reasonOf(error: unknown): { reason: string; status: number | null } {
  if (error instanceof ApiError) return { reason: error.message, status: error.status };
  const e = error as { status?: number; body?: { error?: { message?: string } }; message?: string } | null;
  return { reason: e?.body?.error?.message ?? e?.message ?? 'The server did not take this record.', status: typeof e?.status === 'number' ? e.status : null };
}

function useQueuedRecords(): QueuedRecord[] {
  return useMutationState({
    // Pending (waiting or sending) ones, and refused ones that the queue owns (a form shows its own).
    filters: {
      mutationKey: [...recordCreateRoot],
      predicate: (m) => m.state.status === 'pending' || (m.state.status === 'error' && (m.state.variables as RecordCreateVariables | undefined)?.queued === true),
    },
    select: (m): QueuedRecord => {
      const refused = m.state.status === 'error';
      const r = refused ? reasonOf(m.state.error) : { reason: null, status: null };
      return {
        id: m.mutationId,
        state: refused ? 'refused' : m.state.isPaused ? 'waiting' : 'sending',
        variables: m.state.variables as RecordCreateVariables,
        reason: r.reason,
        status: r.status,
        submittedAt: m.state.submittedAt,
      };
    },
  });
}

function useOnline(): boolean {
  return useSyncExternalStore(
    (l) => onlineManager.subscribe(l),
    () => onlineManager.isOnline(),
    () => true,
  );
}

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/**
 * The offline queue in the app shell: how many records (and photos) wait on this device to be
 * sent, sending itself when the connection returns. A record the server refused stays here with
 * its reason and three ways out: send it again (same key), reopen it in its form, or discard it.
 */
export function OfflineQueue() {
  const t = useTheme();
  const online = useOnline();
  const qc = useQueryClient();
  const records = useQueuedRecords();
  useEffect(() => {
    if (!online) return;
    void warmOfflineCache(qc);
    // A queued create whose connection failed mid-send (no answer at all) goes again, with its key.
    for (const m of qc.getMutationCache().getAll()) {
      const v = m.state.variables as RecordCreateVariables | undefined;
      if (m.state.status === 'error' && v?.queued && m.options.mutationKey?.[1] === recordCreateRoot[1] && reasonOf(m.state.error).status === 0) {
        qc.getMutationCache().remove(m);
        void qc.getMutationCache().build(qc, { mutationKey: m.options.mutationKey }).execute(v).catch(() => undefined);
      }
    }
  }, [online, qc]);
  // A photo of a Quick check still being written is not waiting yet; one of a check in this queue is.
  const photos = useAllQueuedPhotos().filter(
    (p) => p.state !== 'waiting-check' || records.some((r) => r.variables.kind === 'inspection' && r.variables.ownerId === p.hiveId),
  );
  const [open, setOpen] = useState(false);
  const refused = records.filter((r) => r.state === 'refused');
  const failedPhotos = photos.filter((p) => p.state === 'failed');
  const waiting = records.length - refused.length;

  if (records.length === 0 && photos.length === 0) {
    return online ? null : (
      <View testID="offline-status" style={{ paddingHorizontal: t.space.md, paddingVertical: t.space.xs, backgroundColor: t.colours.sunk }}>
        <Text variant="small">No connection. Showing what this device kept; new records wait here until it returns.</Text>
      </View>
    );
  }

  const parts = [
    waiting > 0 ? `${plural(waiting, 'record', 'records')} waiting to send` : null,
    photos.length - failedPhotos.length > 0 ? `${plural(photos.length - failedPhotos.length, 'photo', 'photos')} waiting` : null,
    refused.length + failedPhotos.length > 0 ? `${plural(refused.length + failedPhotos.length, 'item', 'items')} not taken by the server` : null,
  ].filter(Boolean);
  const expanded = open || refused.length + failedPhotos.length > 0;

  return (
    <View
      testID="offline-queue"
      style={{
        paddingHorizontal: t.space.md,
        paddingVertical: t.space.sm,
        gap: t.targetGap,
        backgroundColor: t.colours.surface,
        borderBottomWidth: t.borderWidth.thin,
        borderBottomColor: t.colours.line,
      }}
    >
      <View style={{ flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: t.targetGap, flexWrap: 'wrap' }}>
        <View style={{ flexShrink: 1, flexGrow: 1, minWidth: 180 }}>
          <Text variant="bodyStrong" testID="offline-queue-summary" accessibilityLiveRegion="polite">
            {parts.join(' · ')}
          </Text>
          <Text variant="small" tone="muted">
            {waiting === 0 && photos.length === failedPhotos.length
              ? 'Kept on this device: send each again, edit it, or discard it.'
              : online
                ? 'Sending now.'
                : 'No connection: kept on this device, sent when the signal returns.'}
          </Text>
        </View>
        {refused.length + failedPhotos.length > 0 ? null : (
          <BigButton
            label={open ? 'Hide' : 'Show'}
            variant="secondary"
            onPress={() => setOpen((o) => !o)}
            testID="offline-queue-toggle"
            accessibilityState={{ expanded: open }}
          />
        )}
      </View>
      {expanded ? (
        // Capped, with its own scroll, so a long queue never pushes the screen itself out of view.
        <ScrollView style={{ maxHeight: 340 }} contentContainerStyle={{ gap: t.targetGap }} testID="offline-queue-list">
          {records.map((r) => (
            <RecordRow key={r.id} item={r} />
          ))}
          {photos.map((p) => (
            <PhotoRow key={p.localId} item={p} />
          ))}
        </ScrollView>
      ) : null}
    </View>
  );
}

function useOwnerName(v: RecordCreateVariables): string {
  const qc = useQueryClient();
  const owner =
    v.kind === 'forage-check' ? qc.getQueryData<{ name: string }>(apiaryKey(v.ownerId)) : qc.getQueryData<{ name: string }>(hiveKey(v.ownerId));
  return owner?.name ?? (v.kind === 'forage-check' ? 'an apiary' : 'a hive');
}

function RecordRow({ item }: { item: QueuedRecord }) {
  const t = useTheme();
  const qc = useQueryClient();
  const router = useRouter();
  const [confirming, setConfirming] = useState(false);
  const name = useOwnerName(item.variables);
  const kind = KIND_LABELS[item.variables.kind] ?? 'Record';
  const when = new Date((item.variables.input as { occurredAt?: string }).occurredAt ?? item.submittedAt);
  const mutation = () => qc.getMutationCache().getAll().find((m) => m.mutationId === item.id);

  const retry = () => {
    const m = mutation();
    if (!m) return;
    // The server freed the key when it refused: the same key is sent again (never a second record).
    qc.getMutationCache().remove(m);
    void qc.getMutationCache().build(qc, { mutationKey: m.options.mutationKey }).execute(item.variables).catch(() => undefined);
  };
  const discard = () => {
    const m = mutation();
    if (m) qc.getMutationCache().remove(m);
  };
  const edit = () => {
    // Back into the form as a kept draft with its key; the queue entry goes, the draft carries it.
    writeLocal(
      draftStorageKey(item.variables.kind, item.variables.ownerId),
      JSON.stringify({ v: 1, idempotencyKey: item.variables.idempotencyKey, values: item.variables.draft, updatedAt: new Date().toISOString() }),
    );
    discard();
    const param = item.variables.kind === 'forage-check' ? 'apiaryId' : 'hiveId';
    router.push({ pathname: FORM_PATHS[item.variables.kind], params: { [param]: item.variables.ownerId } } as never);
  };

  return (
    <View
      testID={`offline-record-${item.state}`}
      style={{
        padding: t.space.sm,
        gap: t.space.xs,
        borderRadius: t.radius.md,
        borderWidth: t.borderWidth.thin,
        borderColor: item.state === 'refused' ? t.colours.red : t.colours.line,
        borderLeftWidth: item.state === 'refused' ? 8 : t.borderWidth.thin,
        backgroundColor: item.state === 'refused' ? t.colours.redTint : t.colours.bg,
      }}
    >
      <Text variant="bodyStrong">
        {kind} · {name}
      </Text>
      <Text variant="small" tone="muted">
        {when.toLocaleString(undefined, { weekday: 'short', day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' })} ·{' '}
        {item.state === 'refused' ? 'Not sent' : item.state === 'waiting' ? 'Waiting for a connection' : 'Sending…'}
      </Text>
      {item.state === 'refused' ? (
        <>
          <Text variant="body" tone="warning" testID="offline-record-reason">
            {item.status === 403 ? 'Refused: ' : item.status === 409 ? 'Conflict: ' : item.status === 400 ? 'Not valid: ' : ''}
            {item.reason}
          </Text>
          <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: t.targetGap }}>
            <BigButton label="Send again" variant="secondary" onPress={retry} testID="offline-record-retry" />
            {item.variables.draft ? <BigButton label="Edit" variant="secondary" onPress={edit} testID="offline-record-edit" /> : null}
            {confirming ? (
              <BigButton label="Yes, discard it" variant="danger" onPress={discard} testID="offline-record-discard-confirm" />
            ) : (
              <BigButton label="Discard" variant="secondary" onPress={() => setConfirming(true)} testID="offline-record-discard" />
            )}
          </View>
        </>
      ) : null}
    </View>
  );
}

function PhotoRow({ item }: { item: QueuedPhoto }) {
  const t = useTheme();
  const status = {
    'waiting-check': 'Waits for its Quick check to be sent',
    queued: 'Waiting to send',
    uploading: `Sending… ${Math.round(item.progress * 100)} %`,
    offline: 'Waiting for a connection',
    failed: 'Not sent',
  }[item.state];
  return (
    <View
      testID={`offline-photo-${item.state}`}
      style={{
        padding: t.space.sm,
        gap: t.space.xs,
        borderRadius: t.radius.md,
        borderWidth: t.borderWidth.thin,
        borderColor: item.state === 'failed' ? t.colours.red : t.colours.line,
        backgroundColor: item.state === 'failed' ? t.colours.redTint : t.colours.bg,
      }}
    >
      <Text variant="bodyStrong">Photo · {item.label}</Text>
      <Text variant="small" tone="muted">
        {status}
      </Text>
      {item.state === 'failed' ? (
        <>
          <Text variant="body" tone="warning">
            {item.error}
          </Text>
          <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: t.targetGap }}>
            <BigButton label="Send again" variant="secondary" onPress={() => retryPhoto(item.localId)} />
            <BigButton label="Discard" variant="secondary" onPress={() => void discardPhoto(item.localId)} />
          </View>
        </>
      ) : null}
    </View>
  );
}

