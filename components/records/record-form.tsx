import type { Href } from 'expo-router';
import { useState, type ReactNode } from 'react';
import { View } from 'react-native';
import { ZodError } from 'zod';
import { ApiError } from '@/components/api/client';
import { useBreakpoints } from '@/components/layout/use-breakpoints';
import { useTheme } from '@/components/theme/use-theme';
import { BackLink } from '@/components/ui/back-link';
import { BigButton } from '@/components/ui/big-button';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { Notice } from '@/components/ui/notice';
import { Screen } from '@/components/ui/screen';
import { Stepper } from '@/components/ui/stepper';
import { Text } from '@/components/ui/text';
import { TextField } from '@/components/ui/text-field';
import { dateFromToday, dayAndTime, daysFromToday, relativeDay, shortDate, VISIT_TIME_LABELS, VISIT_TIMES, visitInstant, type VisitTime } from './when';
import type { IsoDate } from '@/shared/domain/dates';

export interface RecordFormScreenProps {
  /** Browser tab and heading, e.g. "Quick check". */
  title: string;
  /** The hive or apiary name, written under the heading and on the back link. */
  subject: string;
  backHref: Href;
  /** Lines between the heading and the form: "Same as last time", a restored draft, cautions. */
  intro?: ReactNode;
  /** The form's groups. On a wide screen the first column holds `left`, the second `right`. */
  left: ReactNode;
  right?: ReactNode;
  /** The save bar: pinned to the bottom, in thumb reach. */
  bottomBar: ReactNode;
  testID?: string;
}

/** Every record form's frame: back link, heading, intro, then one column on phones and two from 1024 px. */
export function RecordFormScreen({ title, subject, backHref, intro, left, right, bottomBar, testID }: RecordFormScreenProps) {
  const t = useTheme();
  const { isWide } = useBreakpoints();
  return (
    <Screen title={`${title} · ${subject}`} bottomBar={bottomBar} testID={testID}>
      <View style={{ gap: t.space.lg }}>
        <View style={{ gap: t.space.xs }}>
          <BackLink href={backHref} label={subject} />
          <Text variant="display">{title}</Text>
        </View>
        {intro}
        {isWide && right ? (
          <View style={{ flexDirection: 'row', gap: t.space.xl, alignItems: 'flex-start' }}>
            <View style={{ flex: 1, gap: t.space.lg }}>{left}</View>
            <View style={{ flex: 1, gap: t.space.lg }}>{right}</View>
          </View>
        ) : (
          <View style={{ gap: t.space.lg }}>
            {left}
            {right}
          </View>
        )}
      </View>
    </Screen>
  );
}

/** The message to show for a failed save; a lost connection says the draft is safe. */
export function saveErrorMessage(error: unknown): { title: string; lines: string[] } {
  if (error instanceof ZodError) {
    return { title: 'Not saved: check these', lines: [...new Set(error.issues.map((i) => i.message))] };
  }
  if (error instanceof ApiError) {
    if (error.status === 0) {
      return { title: 'Not saved yet', lines: ['No connection to Frameside. The record is kept on this device: tap Save again when you have signal.'] };
    }
    const fields = Object.values(error.fields);
    return { title: 'Not saved', lines: fields.length ? fields : [error.message] };
  }
  if (error instanceof Error && error.message) return { title: 'Not saved', lines: [error.message] };
  return { title: 'Not saved yet', lines: ['Something went wrong. The record is kept on this device: tap Save again.'] };
}

export interface SaveBarProps {
  testID: string;
  label: string;
  onSave: () => void;
  saving: boolean;
  error: unknown;
}

/** The bottom bar: what went wrong (if anything) right above the one big Save button. */
export function SaveBar({ testID, label, onSave, saving, error }: SaveBarProps) {
  const msg = error ? saveErrorMessage(error) : null;
  return (
    <>
      {msg ? (
        <Notice tone="warning" title={msg.title} testID={`${testID}-error`}>
          <View>
            {msg.lines.map((l) => (
              <Text key={l}>{l}</Text>
            ))}
          </View>
        </Notice>
      ) : null}
      <BigButton testID={testID} label={label} loading={saving} loadingLabel="Saving…" onPress={onSave} fullWidth />
    </>
  );
}

/** A group of fields under a small heading, without a card (cards inside cards waste width on phones). */
export function FormGroup({ title, children, testID }: { title: string; children: ReactNode; testID?: string }) {
  const t = useTheme();
  return (
    <View
      testID={testID}
      style={{
        gap: t.space.md,
        padding: t.space.md,
        borderRadius: t.radius.lg,
        borderWidth: t.borderWidth.thin,
        borderColor: t.colours.line,
        backgroundColor: t.colours.surface,
      }}
    >
      <Text variant="heading">{title}</Text>
      {children}
    </View>
  );
}

const visitOptions = VISIT_TIMES.map((v) => ({ value: v, label: VISIT_TIME_LABELS[v] }));

/** When it happened, by chips, with the resulting time written out: no keyboard, no picker. */
export function VisitTimeField({
  value,
  onChange,
  now,
  fixedAt,
  label = 'Visit time',
}: {
  value: VisitTime;
  onChange: (v: VisitTime) => void;
  now: Date;
  /** The instant already fixed for this draft (after a first Save press), shown instead. */
  fixedAt?: string | null;
  label?: string;
}) {
  const t = useTheme();
  return (
    <View style={{ gap: t.space.xs }}>
      <ChoiceChips field="visitTime" label={label} options={visitOptions} value={value} onChange={onChange} />
      <Text tone="muted" testID="visit-time-text">
        {dayAndTime(fixedAt ?? visitInstant(value, now))}
      </Text>
    </View>
  );
}

export interface DateFieldProps {
  field: string;
  label: string;
  value: IsoDate | null;
  onChange: (v: IsoDate | null) => void;
  now: Date;
  /** Days from today the stepper may reach (e.g. −60 … +1). */
  minDays: number;
  maxDays: number;
  /** An optional date starts unset behind an "Add …" button and can be cleared. */
  optional?: boolean;
  /** The date an optional field starts from when added (default today). */
  startFrom?: IsoDate;
  hint?: string;
}

/** A date by ±1 day steppers from today, written "12 May" with "today / in 3 days" beside the label. */
export function DateField({ field, label, value, onChange, now, minDays, maxDays, optional, startFrom, hint }: DateFieldProps) {
  const t = useTheme();
  if (value === null) {
    return (
      <View style={{ gap: t.space.xs }}>
        <Text variant="label">{label}</Text>
        {hint ? <Text variant="small" tone="muted">{hint}</Text> : null}
        <BigButton testID={`date-${field}-set`} variant="secondary" label={`Add ${label.toLowerCase()}`} onPress={() => onChange(startFrom ?? dateFromToday(0, now))} />
      </View>
    );
  }
  const offset = daysFromToday(value, now);
  return (
    <View style={{ gap: t.space.xs }}>
      <Stepper
        field={field}
        label={`${label}: ${relativeDay(offset)}`}
        value={offset}
        min={Math.min(minDays, offset)}
        max={Math.max(maxDays, offset)}
        onChange={(d) => onChange(dateFromToday(d, now))}
        format={(d) => shortDate(dateFromToday(d, now))}
        decreaseLabel={`${label} one day earlier`}
        increaseLabel={`${label} one day later`}
        hint={hint}
      />
      {optional ? (
        <BigButton testID={`date-${field}-clear`} variant="secondary" label="Clear date" onPress={() => onChange(null)} />
      ) : null}
    </View>
  );
}

/** The optional short note, folded away until asked for: the only place a keyboard appears. */
export function NoteField({ value, onChange, max = 500 }: { value: string; onChange: (v: string) => void; max?: number }) {
  const [open, setOpen] = useState(value.length > 0);
  if (!open) {
    return <BigButton testID="note-open" variant="secondary" label="Add a note" onPress={() => setOpen(true)} fullWidth />;
  }
  return (
    <TextField
      testID="note"
      label="Note (optional)"
      value={value}
      onChangeText={onChange}
      multiline
      maxLength={max}
      hint={`Up to ${max} characters.`}
    />
  );
}
