import { Link, useLocalSearchParams } from 'expo-router';
import { useMemo, useState } from 'react';
import { View } from 'react-native';
import { useHiveQuery } from '@/components/api/hives';
import { useSensorImportMutation } from '@/components/api/sensors';
import { useTheme } from '@/components/theme/use-theme';
import { BackLink } from '@/components/ui/back-link';
import { BigButton } from '@/components/ui/big-button';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { Notice } from '@/components/ui/notice';
import { LoadError, Loading } from '@/components/ui/query-state';
import { Screen } from '@/components/ui/screen';
import { Section } from '@/components/ui/section';
import { Text } from '@/components/ui/text';
import {
  COMMON_TIME_ZONES,
  SensorMappingError,
  describeBadRows,
  mapReadings,
  readCsv,
  suggestColumns,
  suggestTimeFormat,
  type SensorMapping,
  type TemperatureUnit,
  type TimeFormat,
  type WeightUnit,
} from '@/shared/domain/sensor-csv';
import type { SensorImportResult } from '@/shared/schemas/sensors';
import { CsvFilePicker, type PickedFile } from './file-picker';

const NONE = '__none__';

const count = (n: number, one: string) => `${n.toLocaleString('en-GB')} ${one}${n === 1 ? '' : 's'}`;
const PREVIEW_ROWS = 8;

const TIME_FORMAT_OPTIONS: { value: TimeFormat; label: string }[] = [
  { value: 'iso', label: '2026-05-31 14:00' },
  { value: 'dmy', label: '31/05/2026 14:00 (day first)' },
  { value: 'mdy', label: '05/31/2026 2:00 PM (month first)' },
  { value: 'epoch-s', label: 'Unix seconds' },
  { value: 'epoch-ms', label: 'Unix milliseconds' },
];

const TEMPERATURE_UNIT_OPTIONS: { value: TemperatureUnit; label: string }[] = [
  { value: 'C', label: '°C' },
  { value: 'F', label: '°F' },
];
const WEIGHT_UNIT_OPTIONS: { value: WeightUnit; label: string }[] = [
  { value: 'kg', label: 'kg' },
  { value: 'lb', label: 'lb' },
];

function defaultZone(): string {
  try {
    const zone = Intl.DateTimeFormat().resolvedOptions().timeZone;
    return (COMMON_TIME_ZONES as readonly string[]).includes(zone) ? zone : 'UTC';
  } catch {
    return 'UTC';
  }
}

interface Choices {
  timeColumn: string;
  temperatureColumn: string;
  weightColumn: string;
  timeFormat: TimeFormat;
  temperatureUnit: TemperatureUnit;
  weightUnit: WeightUnit;
  timeZone: string;
}

/**
 * /hives/[hiveId]/sensor-import: a logger's CSV into this hive. The file is read here with the
 * same shared module the server uses, so the preview — columns, first rows, what each becomes,
 * which lines will be skipped and why — is what the import will do. The server stores each
 * instant once: importing the same file again adds nothing.
 */
export function SensorImportScreen() {
  const { hiveId } = useLocalSearchParams<{ hiveId: string }>();
  const t = useTheme();
  const hive = useHiveQuery(hiveId);
  const mutation = useSensorImportMutation(hiveId ?? '');
  const [file, setFile] = useState<PickedFile | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const [choices, setChoices] = useState<Choices | null>(null);
  const [progress, setProgress] = useState(0);
  const [result, setResult] = useState<SensorImportResult | null>(null);

  const preview = useMemo(() => (file ? readCsv(file.text, { maxRows: PREVIEW_ROWS }) : null), [file]);

  const pick = (f: PickedFile) => {
    setFileError(null);
    setResult(null);
    mutation.reset();
    const table = readCsv(f.text, { maxRows: 50 });
    if (table.headers.length < 2) {
      setFile(null);
      setFileError('This file has fewer than two columns. A logger file needs a time column and a temperature or weight column.');
      return;
    }
    const guess = suggestColumns(table.headers);
    const time = guess.time ?? table.headers[0];
    const ti = table.headers.indexOf(time);
    setFile(f);
    setChoices({
      timeColumn: time,
      temperatureColumn: guess.temperature ?? NONE,
      weightColumn: guess.weight ?? NONE,
      timeFormat: suggestTimeFormat(table.rows.map((r) => r[ti] ?? '')).format,
      temperatureUnit: guess.temperatureUnit,
      weightUnit: guess.weightUnit,
      timeZone: defaultZone(),
    });
  };

  const mapping: SensorMapping | null = choices
    ? {
        timeColumn: choices.timeColumn,
        temperatureColumn: choices.temperatureColumn === NONE ? null : choices.temperatureColumn,
        weightColumn: choices.weightColumn === NONE ? null : choices.weightColumn,
        timeFormat: choices.timeFormat,
        temperatureUnit: choices.temperatureUnit,
        weightUnit: choices.weightUnit,
        timeZone: choices.timeZone,
      }
    : null;

  // The whole file, mapped as the server will: counts and the bad lines before anything is sent.
  const check = useMemo(() => {
    if (!file || !mapping) return null;
    try {
      const out = mapReadings(readCsv(file.text), mapping);
      return { ok: true as const, readings: out.readings.length, rows: out.rows, bad: out.bad, repeated: out.repeated.length, first: out.readings.slice(0, 3) };
    } catch (err) {
      if (err instanceof SensorMappingError) return { ok: false as const, message: err.message };
      throw err;
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [file, JSON.stringify(mapping)]);

  if (hive.isPending || hive.isError) {
    return (
      <Screen title="Import sensor log">
        {hive.isPending ? <Loading /> : <LoadError error={hive.error} onRetry={() => void hive.refetch()} />}
      </Screen>
    );
  }
  const h = hive.data;
  const set = <K extends keyof Choices>(k: K) => (v: Choices[K]) => setChoices((c) => (c ? { ...c, [k]: v } : c));
  const columnOptions = (preview?.headers ?? []).map((hd) => ({ value: hd, label: hd }));
  const canImport = Boolean(file && mapping && check?.ok && check.readings > 0) && !mutation.isPending;

  const start = () => {
    if (!file || !mapping) return;
    setProgress(0);
    setResult(null);
    mutation.mutate(
      {
        csv: file.text,
        query: { fileName: file.name, ...mapping, delimiter: preview?.delimiter === ';' ? 'semicolon' : preview?.delimiter === '\t' ? 'tab' : 'comma' },
        onProgress: setProgress,
      },
      { onSuccess: setResult },
    );
  };

  return (
    <Screen
      title={`${h.name} · Import sensor log`}
      testID="sensor-import-screen"
      bottomBar={
        file ? (
          <BigButton
            testID="sensor-import-submit"
            label={result ? 'Import again' : 'Import readings'}
            fullWidth
            loading={mutation.isPending}
            loadingLabel={progress < 1 ? `Sending… ${Math.round(progress * 100)} %` : 'Saving readings…'}
            disabled={!canImport}
            onPress={start}
          />
        ) : null
      }
    >
      <View style={{ gap: t.space.lg }}>
        <View style={{ gap: t.space.xs }}>
          <BackLink href={{ pathname: '/hives/[hiveId]/season', params: { hiveId: h.id } }} label={`${h.name} · Season review`} />
          <Text variant="display">{`Import a sensor log into ${h.name}`}</Text>
          <Text tone="muted">
            A CSV file from a hive logger: a time column and a temperature column, a weight column, or both. Header names can be anything; you choose which is which.
          </Text>
        </View>

        <Section title="1. The file">
          <CsvFilePicker label={file ? 'Choose another file' : 'Choose a CSV file'} onFile={pick} onError={setFileError} />
          {fileError ? (
            <Notice tone="warning" title="Not this file" testID="sensor-file-error">
              {fileError}
            </Notice>
          ) : null}
          {file && preview ? (
            <View style={{ gap: t.space.sm }} testID="sensor-preview">
              <Text variant="bodyStrong">{`${file.name} · ${(file.size / 1024).toFixed(0)} KB · columns separated by ${preview.delimiter === ';' ? 'semicolons' : preview.delimiter === '\t' ? 'tabs' : 'commas'}`}</Text>
              <PreviewTable headers={preview.headers} rows={preview.rows} lines={preview.lines} />
            </View>
          ) : null}
        </Section>

        {file && choices && preview ? (
          <Section title="2. Which column is which">
            <ChoiceChips field="sensor-time-column" label="Time" options={columnOptions} value={choices.timeColumn} onChange={set('timeColumn')} />
            <ChoiceChips field="sensor-time-format" label="Times are written like" options={TIME_FORMAT_OPTIONS} value={choices.timeFormat} onChange={set('timeFormat')} />
            <ChoiceChips
              field="sensor-time-zone"
              label="Time zone of the logger's clock"
              hint="Used for times written without a zone; a time ending in Z or +02:00 keeps its own."
              options={COMMON_TIME_ZONES.map((z): { value: string; label: string } => ({ value: z, label: z.replace('_', ' ') }))}
              value={choices.timeZone}
              onChange={set('timeZone')}
            />
            <ChoiceChips field="sensor-temperature-column" label="Temperature" options={[{ value: NONE, label: 'None' }, ...columnOptions]} value={choices.temperatureColumn} onChange={set('temperatureColumn')} />
            {choices.temperatureColumn !== NONE ? (
              <ChoiceChips field="sensor-temperature-unit" label="Temperature unit" options={TEMPERATURE_UNIT_OPTIONS} value={choices.temperatureUnit} onChange={set('temperatureUnit')} />
            ) : null}
            <ChoiceChips field="sensor-weight-column" label="Weight" options={[{ value: NONE, label: 'None' }, ...columnOptions]} value={choices.weightColumn} onChange={set('weightColumn')} />
            {choices.weightColumn !== NONE ? (
              <ChoiceChips field="sensor-weight-unit" label="Weight unit" options={WEIGHT_UNIT_OPTIONS} value={choices.weightUnit} onChange={set('weightUnit')} />
            ) : null}
          </Section>
        ) : null}

        {check ? (
          <Section title="3. What will be imported">
            {!check.ok ? (
              <Notice tone="warning" title="Choose again" testID="sensor-mapping-error">
                {check.message}
              </Notice>
            ) : (
              <View style={{ gap: t.space.sm }} testID="sensor-check">
                <Text variant="bodyStrong" testID="sensor-check-summary">
                  {`${count(check.rows, 'row')}: ${count(check.readings, 'reading')}${check.bad.length ? `, ${count(check.bad.length, 'bad row')} to skip` : ''}${check.repeated ? `, ${count(check.repeated, 'row')} repeating a time` : ''}.`}
                </Text>
                {check.first.map((r) => (
                  <Text key={r.atMs} tone="muted">
                    {`${new Date(r.atMs).toISOString().replace('T', ' ').slice(0, 16)} UTC → ${r.temperatureC != null ? `${r.temperatureC.toFixed(1)} °C` : '—'}, ${r.weightKg != null ? `${r.weightKg.toFixed(2)} kg` : '—'}`}
                  </Text>
                ))}
                {check.bad.length ? (
                  <Notice tone="warning" title="These lines will be skipped" testID="sensor-bad-rows">
                    {describeBadRows(check.bad, 10)}
                  </Notice>
                ) : null}
              </View>
            )}
          </Section>
        ) : null}

        {mutation.isPending ? (
          <View testID="sensor-progress" style={{ gap: t.space.xs }} accessibilityRole="progressbar" accessibilityValue={{ min: 0, max: 100, now: Math.round(progress * 100) }}>
            <Text>{progress < 1 ? `Sending the file: ${Math.round(progress * 100)} %` : 'File sent; storing the readings…'}</Text>
            <View style={{ height: 16, borderRadius: t.radius.pill, borderWidth: t.borderWidth.thin, borderColor: t.colours.ink, backgroundColor: t.colours.surface, overflow: 'hidden' }}>
              <View style={{ width: `${Math.round(progress * 100)}%`, height: '100%', backgroundColor: t.colours.ink }} />
            </View>
          </View>
        ) : null}
        {mutation.isError ? (
          <Notice tone="warning" title="Not imported" testID="sensor-import-error">
            {mutation.error.message}
          </Notice>
        ) : null}
        {result ? (
          <Notice tone="good" title="Imported" testID="sensor-import-result">
            {`${result.summary}${result.sameFileBefore ? ' This file had been imported into this hive before.' : ''}`}
          </Notice>
        ) : null}
        {result ? (
          <Link href={{ pathname: '/hives/[hiveId]/season', params: { hiveId: h.id } }} asChild>
            <BigButton testID="sensor-open-season" variant="secondary" label="Open the Season review" />
          </Link>
        ) : null}
      </View>
    </Screen>
  );
}

function PreviewTable({ headers, rows, lines }: { headers: string[]; rows: string[][]; lines: number[] }) {
  const t = useTheme();
  const cell = { minWidth: 120, flex: 1, paddingVertical: 4, paddingHorizontal: t.space.xs } as const;
  return (
    <View style={{ borderWidth: t.borderWidth.thin, borderColor: t.colours.line, borderRadius: t.radius.sm }} testID="sensor-preview-table">
      <View style={{ flexDirection: 'row', backgroundColor: t.colours.sunk }}>
        <Text variant="label" style={{ width: 56, padding: 4 }}>
          Line
        </Text>
        {headers.map((h) => (
          <Text key={h} variant="label" style={cell}>
            {h}
          </Text>
        ))}
      </View>
      {rows.map((r, i) => (
        <View key={lines[i]} style={{ flexDirection: 'row', borderTopWidth: 1, borderTopColor: t.colours.line }} testID="sensor-preview-row">
          <Text tone="muted" style={{ width: 56, padding: 4 }}>
            {String(lines[i])}
          </Text>
          {headers.map((h, j) => (
            <Text key={h} style={cell}>
              {r[j] ?? ''}
            </Text>
          ))}
        </View>
      ))}
    </View>
  );
}
