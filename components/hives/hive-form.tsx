import { Formik, useFormikContext, type FormikErrors, type FormikHelpers } from 'formik';
import type { ReactNode } from 'react';
import { View } from 'react-native';
import { FRAME_SIZES, HIVE_STATUSES, MARK_COLOURS, QUEEN_ORIGINS, type FrameSize } from '@/shared/domain/hives';
import { FormTextField } from '@/components/form/form-text-field';
import { useBreakpoints } from '@/components/layout/use-breakpoints';
import { visibleError } from '@/components/form/zod-formik';
import { useTheme } from '@/components/theme/use-theme';
import { BigButton } from '@/components/ui/big-button';
import { ChoiceChips, type ChipOption } from '@/components/ui/choice-chips';
import { FieldError } from '@/components/ui/field';
import { CrossIcon, PlusIcon } from '@/components/ui/icons';
import { Screen } from '@/components/ui/screen';
import { Section } from '@/components/ui/section';
import { Stepper } from '@/components/ui/stepper';
import { Text } from '@/components/ui/text';
import { FRAME_SIZE_LABELS, HIVE_STATUS_LABELS, MARK_COLOUR_LABELS, QUEEN_ORIGIN_LABELS } from './hive-labels';
import { FRAMES_MAX, FRAMES_MIN, MAX_BOXES, QUEEN_YEAR_MIN, queenYearMax, type HiveFormValues } from './hive-form-values';

const sizeOptions: ChipOption<FrameSize>[] = FRAME_SIZES.map((s) => ({ value: s, label: FRAME_SIZE_LABELS[s] }));
const statusOptions = HIVE_STATUSES.map((s) => ({ value: s, label: HIVE_STATUS_LABELS[s] }));
const originOptions = QUEEN_ORIGINS.map((o) => ({ value: o, label: QUEEN_ORIGIN_LABELS[o] }));
const yesNo = [
  { value: 'yes', label: 'Yes' },
  { value: 'no', label: 'No' },
] as const satisfies readonly ChipOption<'yes' | 'no'>[];
const yearKnownOptions = [
  { value: 'yes', label: 'Year known' },
  { value: 'no', label: 'Not known' },
] as const satisfies readonly ChipOption<'yes' | 'no'>[];

export interface HiveFormProps {
  /** Browser-tab title and the heading. */
  title: string;
  /** Shown above the heading: a back link. */
  header?: ReactNode;
  /** Shown under the heading: a conflict or server message. */
  notice?: ReactNode;
  initialValues: HiveFormValues;
  validate: (values: HiveFormValues) => FormikErrors<HiveFormValues>;
  onSubmit: (values: HiveFormValues, helpers: FormikHelpers<HiveFormValues>) => Promise<void>;
  submitLabel: string;
}

/**
 * The hive's description: one typed field (the name), everything else chips and steppers.
 * Used by "Add hive" and "Edit hive"; validated by the same zod schema as the request.
 */
export function HiveForm({ title, header, notice, initialValues, validate, onSubmit, submitLabel }: HiveFormProps) {
  return (
    <Formik<HiveFormValues> initialValues={initialValues} validate={validate} onSubmit={onSubmit}>
      <HiveFormBody title={title} header={header} notice={notice} submitLabel={submitLabel} />
    </Formik>
  );
}

function HiveFormBody({ title, header, notice, submitLabel }: Pick<HiveFormProps, 'title' | 'header' | 'notice' | 'submitLabel'>) {
  const t = useTheme();
  const { isWide } = useBreakpoints();
  const { values, errors, touched, submitCount, setFieldValue, handleSubmit, isSubmitting } = useFormikContext<HiveFormValues>();
  const set = <K extends keyof HiveFormValues>(key: K, v: HiveFormValues[K]) => void setFieldValue(key, v);
  const setQueen = <K extends keyof HiveFormValues['queen']>(key: K, v: HiveFormValues['queen'][K]) =>
    void setFieldValue(`queen.${key}`, v);
  const err = (path: string) => visibleError(errors, touched, path, submitCount);

  const setBox = (i: number, patch: Partial<HiveFormValues['boxes'][number]>) =>
    set(
      'boxes',
      values.boxes.map((b, j) => (j === i ? { ...b, ...patch } : b)),
    );
  // A new box goes on top and copies the box below it: supers are usually added in like kind.
  const addBox = () => set('boxes', [...values.boxes, { ...values.boxes[values.boxes.length - 1] }]);
  const removeBox = (i: number) => set('boxes', values.boxes.filter((_, j) => j !== i));

  const boxesError = err('boxes');
  const yearMax = queenYearMax();

  const makeUp = (
    <>
      <FormTextField name="name" testID="hive-name" label="Hive name" hint="A name or number painted on the hive." autoCapitalize="words" returnKeyType="done" />

      <Section title="Boxes" testID="hive-boxes">
        <Text tone="muted">Box 1 stands on the floor; add boxes upwards.</Text>
        {values.boxes.map((box, i) => (
          <View
            key={i}
            testID={`box-${i}`}
            style={{ gap: t.space.md, paddingTop: t.space.md, borderTopWidth: t.borderWidth.thin, borderTopColor: t.colours.line }}
          >
            <Text variant="heading">{i === 0 ? 'Box 1 · bottom' : `Box ${i + 1}`}</Text>
            <ChoiceChips
              field={`box-${i}-size`}
              label={`Size of box ${i + 1}`}
              options={sizeOptions}
              value={box.size}
              onChange={(size) => setBox(i, { size })}
            />
            <Stepper
              field={`box-${i}-frames`}
              label={`Frames in box ${i + 1}`}
              decreaseLabel={`Fewer frames in box ${i + 1}`}
              increaseLabel={`More frames in box ${i + 1}`}
              value={box.frames}
              min={FRAMES_MIN}
              max={FRAMES_MAX}
              onChange={(frames) => setBox(i, { frames })}
            />
            {err(`boxes.${i}.frames`) ? <FieldError message={err(`boxes.${i}.frames`)!} /> : null}
            {values.boxes.length > 1 ? (
              <BigButton
                testID={`remove-box-${i}`}
                variant="secondary"
                label={`Remove box ${i + 1}`}
                icon={(c) => <CrossIcon colour={c} />}
                onPress={() => removeBox(i)}
              />
            ) : null}
          </View>
        ))}
        {boxesError ? <FieldError message={boxesError} /> : null}
        <BigButton
          testID="add-box"
          variant="secondary"
          label={values.boxes.length >= MAX_BOXES ? `${MAX_BOXES} boxes is the most` : 'Add a box on top'}
          icon={(c) => <PlusIcon colour={c} size={24} />}
          disabled={values.boxes.length >= MAX_BOXES}
          fullWidth
          onPress={addBox}
        />
      </Section>
    </>
  );

  const statusAndQueen = (
    <>
      <Section title="Status">
        <ChoiceChips field="status" label="Hive status" hideLabel options={statusOptions} value={values.status} onChange={(s) => set('status', s)} />
        {err('status') ? <FieldError message={err('status')!} /> : null}
      </Section>

      <Section title="Queen">
        <ChoiceChips
          field="queen-recorded"
          label="Record a queen for this hive?"
          options={yesNo}
          value={values.hasQueen ? 'yes' : 'no'}
          onChange={(v) => set('hasQueen', v === 'yes')}
        />
        {values.hasQueen ? (
          <>
            <ChoiceChips
              field="queen-origin"
              label="Where she came from"
              options={originOptions}
              value={values.queen.origin}
              onChange={(v) => setQueen('origin', v)}
            />
            <ChoiceChips
              field="queen-year-known"
              label="Year she was born"
              options={yearKnownOptions}
              value={values.queen.yearKnown ? 'yes' : 'no'}
              onChange={(v) => setQueen('yearKnown', v === 'yes')}
            />
            {values.queen.yearKnown ? (
              <Stepper
                field="queen-year"
                label="Queen’s year"
                decreaseLabel="One year earlier"
                increaseLabel="One year later"
                value={values.queen.year}
                min={Math.min(QUEEN_YEAR_MIN, values.queen.year)}
                max={yearMax}
                format={String}
                onChange={(v) => setQueen('year', v)}
              />
            ) : null}
            {err('queen.year') ? <FieldError message={err('queen.year')!} /> : null}
            <ChoiceChips
              field="queen-mark"
              label="Marking colour"
              options={MARK_COLOURS.map((c) => ({
                value: c,
                label: MARK_COLOUR_LABELS[c],
                swatch: c === 'unmarked' ? undefined : t.markSwatch[c],
              }))}
              value={values.queen.markColour}
              onChange={(v) => setQueen('markColour', v)}
            />
            <ChoiceChips
              field="queen-clipped"
              label="Wing clipped?"
              options={yesNo}
              value={values.queen.clipped ? 'yes' : 'no'}
              onChange={(v) => setQueen('clipped', v === 'yes')}
            />
          </>
        ) : null}
      </Section>
    </>
  );

  return (
    <Screen
      title={title}
      width={isWide ? 'page' : 'form'}
      bottomBar={
        <BigButton testID="hive-save" label={submitLabel} loadingLabel="Saving…" loading={isSubmitting} fullWidth onPress={() => handleSubmit()} />
      }
    >
      <View style={{ gap: t.space.lg }}>
        {header}
        <Text variant="display">{title}</Text>
        {notice}
        {isWide ? (
          // Two panes: the hive's make-up on the left, its status and queen on the right.
          <View style={{ flexDirection: 'row', gap: t.space.xl, alignItems: 'flex-start' }}>
            <View style={{ flex: 1, gap: t.space.lg }}>{makeUp}</View>
            <View style={{ flex: 1, gap: t.space.lg }}>{statusAndQueen}</View>
          </View>
        ) : (
          <>
            {makeUp}
            {statusAndQueen}
          </>
        )}
      </View>
    </Screen>
  );
}
