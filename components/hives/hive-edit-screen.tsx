import { useLocalSearchParams, useRouter } from 'expo-router';
import { useState } from 'react';
import type { HiveDto } from '@/shared/schemas/hives';
import { hiveUpdateSchema } from '@/shared/schemas/hives';
import { ApiError } from '@/components/api/client';
import { staleHiveOf, useHiveQuery, useHiveUpdateMutation } from '@/components/api/hives';
import { serverFieldErrors, zodFormikValidate } from '@/components/form/zod-formik';
import { BackLink } from '@/components/ui/back-link';
import { Notice } from '@/components/ui/notice';
import { LoadError, Loading } from '@/components/ui/query-state';
import { Screen } from '@/components/ui/screen';
import { HiveForm } from './hive-form';
import { hiveToValues, toUpdateInput, type HiveFormValues } from './hive-form-values';

const validate = zodFormikValidate(hiveUpdateSchema, (v: HiveFormValues) => toUpdateInput(v));

type Message = { kind: 'conflict' } | { kind: 'error'; text: string } | null;

/**
 * "Edit hive". The form starts from the version loaded first and keeps it, even if the cache
 * refreshes meanwhile, so a background refetch never wipes what the keeper has entered. When
 * the save finds a newer version (409), the form reloads with it and says so.
 */
export function HiveEditScreen() {
  const { hiveId } = useLocalSearchParams<{ hiveId: string }>();
  const router = useRouter();
  const hive = useHiveQuery(hiveId);
  const update = useHiveUpdateMutation(hiveId);
  const [base, setBase] = useState<HiveDto | null>(null);
  const [message, setMessage] = useState<Message>(null);

  // Pin the first loaded version (a state update during render: React re-renders at once).
  if (base === null && hive.data) setBase(hive.data);
  const current = base ?? hive.data;
  if (!current) {
    return (
      <Screen title="Edit hive" width="form">
        {hive.isError ? <LoadError error={hive.error} onRetry={() => void hive.refetch()} /> : <Loading label="Loading the hive…" />}
      </Screen>
    );
  }

  const notice =
    message?.kind === 'conflict' ? (
      <Notice tone="warning" testID="hive-conflict" title="Someone else changed this hive — here is the current version">
        Check it, make your change again and save.
      </Notice>
    ) : message?.kind === 'error' ? (
      <Notice tone="warning" testID="hive-form-error">
        {message.text}
      </Notice>
    ) : null;

  return (
    <HiveForm
      // A new base (after a 409) is a fresh form with the server's values.
      key={`${current.id}:${current.version}`}
      title={`Edit ${current.name}`}
      submitLabel="Save changes"
      header={<BackLink href={{ pathname: '/hives/[hiveId]', params: { hiveId: current.id } }} label={current.name} />}
      notice={notice}
      initialValues={hiveToValues(current)}
      validate={validate}
      onSubmit={async (values, { setErrors }) => {
        setMessage(null);
        try {
          await update.mutateAsync(hiveUpdateSchema.parse(toUpdateInput(values, current.version)));
          if (router.canGoBack()) router.back();
          else router.replace({ pathname: '/hives/[hiveId]', params: { hiveId: current.id } });
        } catch (err) {
          const stale = staleHiveOf(err);
          if (stale) {
            setBase(stale);
            setMessage({ kind: 'conflict' });
            return;
          }
          setMessage({ kind: 'error', text: err instanceof Error ? err.message : 'The changes were not saved.' });
          if (err instanceof ApiError) setErrors(serverFieldErrors<HiveFormValues>(err.fields));
        }
      }}
    />
  );
}
