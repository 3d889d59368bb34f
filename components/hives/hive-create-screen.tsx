import { useLocalSearchParams, useRouter } from 'expo-router';
import { useMemo, useState } from 'react';
import { hiveCreateSchema } from '@/shared/schemas/hives';
import { useApiaryQuery } from '@/components/api/apiaries';
import { ApiError } from '@/components/api/client';
import { useHiveCreateMutation } from '@/components/api/hives';
import { serverFieldErrors, zodFormikValidate } from '@/components/form/zod-formik';
import { BackLink } from '@/components/ui/back-link';
import { Notice } from '@/components/ui/notice';
import { HiveForm } from './hive-form';
import { newHiveValues, toCreateInput, type HiveFormValues } from './hive-form-values';

const validate = zodFormikValidate(hiveCreateSchema, toCreateInput);

/** "Add hive" in an apiary. Saving opens the new hive's page. */
export function HiveCreateScreen() {
  const { apiaryId } = useLocalSearchParams<{ apiaryId: string }>();
  const router = useRouter();
  const apiary = useApiaryQuery(apiaryId);
  const create = useHiveCreateMutation(apiaryId);
  const initialValues = useMemo(newHiveValues, []);
  const [message, setMessage] = useState<string | null>(null);

  return (
    <HiveForm
      title="Add hive"
      submitLabel="Save hive"
      header={<BackLink href={{ pathname: '/apiaries/[apiaryId]', params: { apiaryId } }} label={apiary.data?.name ?? 'Apiary'} />}
      notice={message ? <Notice tone="warning" testID="hive-form-error">{message}</Notice> : null}
      initialValues={initialValues}
      validate={validate}
      onSubmit={async (values, { setErrors }) => {
        setMessage(null);
        try {
          const hive = await create.mutateAsync(hiveCreateSchema.parse(toCreateInput(values)));
          // Replace: going back from the new hive should land on the apiary, not this form.
          router.replace({ pathname: '/hives/[hiveId]', params: { hiveId: hive.id } });
        } catch (err) {
          setMessage(err instanceof Error ? err.message : 'The hive was not saved.');
          if (err instanceof ApiError) setErrors(serverFieldErrors<HiveFormValues>(err.fields));
        }
      }}
    />
  );
}
