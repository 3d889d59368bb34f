/**
 * Hive-logger CSV reading and mapping (shared/domain/sensor-csv). The files here are invented
 * test inputs; the conversion factors are exact by definition (lb = 0.45359237 kg,
 * °F → °C = (F − 32) × 5/9), and the brood-nest temperatures used as sample values are in the
 * 33–36 °C band of Kleinhenz et al. 2003 (TRADE-REFERENCES §8) only to look like a real log.
 */
import {
  detectDelimiter,
  mapReadings,
  parseDecimal,
  parseLoggerTime,
  readCsv,
  SensorMappingError,
  suggestColumns,
  suggestTimeFormat,
  zonedTimeToUtc,
  type SensorMapping,
} from '@/shared/domain/sensor-csv';

const base: SensorMapping = {
  timeColumn: 'Time',
  temperatureColumn: 'Temp',
  weightColumn: 'Weight',
  timeFormat: 'iso',
  temperatureUnit: 'C',
  weightUnit: 'kg',
  timeZone: 'UTC',
};

describe('reading logger CSV files', () => {
  it('reads quoted fields, including a delimiter and a line break inside quotes, with exact line numbers', () => {
    const csv = 'Time,Temp,Weight,Note\n2026-05-01 10:00,34.5,40.2,"lid, propped"\n2026-05-01 11:00,34.6,40.3,"two\nlines"\n2026-05-01 12:00,x,40.4,\n';
    const table = readCsv(csv);
    expect(table.headers).toEqual(['Time', 'Temp', 'Weight', 'Note']);
    expect(table.rows[0][3]).toBe('lid, propped');
    expect(table.rows[1][3]).toBe('two\nlines');
    expect(table.lines).toEqual([2, 3, 5]);
    const out = mapReadings(table, base);
    expect(out.readings).toHaveLength(2);
    expect(out.bad).toEqual([{ line: 5, reason: 'temperature "x" is not a number' }]);
  });

  it('detects semicolons and reads decimal commas', () => {
    const csv = 'Zeit;Temperatur °C;Gewicht kg\n01.05.2026 10:00;34,5;40,25\n01.05.2026 11:00;34,75;40,5\n';
    expect(detectDelimiter(csv)).toBe(';');
    const table = readCsv(csv);
    const guess = suggestColumns(table.headers);
    expect(guess).toMatchObject({ time: 'Zeit', temperature: 'Temperatur °C', weight: 'Gewicht kg', temperatureUnit: 'C', weightUnit: 'kg' });
    expect(suggestTimeFormat(table.rows.map((r) => r[0]))).toEqual({ format: 'dmy', ambiguous: true });
    const out = mapReadings(table, { ...base, timeColumn: 'Zeit', temperatureColumn: 'Temperatur °C', weightColumn: 'Gewicht kg', timeFormat: 'dmy' });
    expect(out.bad).toEqual([]);
    expect(out.readings.map((r) => [new Date(r.atMs).toISOString(), r.temperatureC, r.weightKg])).toEqual([
      ['2026-05-01T10:00:00.000Z', 34.5, 40.25],
      ['2026-05-01T11:00:00.000Z', 34.75, 40.5],
    ]);
  });

  it('removes a UTF-8 byte-order mark so the first header matches', () => {
    const table = readCsv('\uFEFFTime,Temp\r\n2026-05-01T10:00:00Z,34.5\r\n');
    expect(table.headers).toEqual(['Time', 'Temp']);
    expect(table.lines).toEqual([2]);
    expect(mapReadings(table, { ...base, weightColumn: null }).readings).toHaveLength(1);
  });

  it('refuses a mapping that names a column the file does not have, saying which', () => {
    const table = readCsv('Time,Temp\n2026-05-01 10:00,34.5\n');
    expect(() => mapReadings(table, base)).toThrow(SensorMappingError);
    expect(() => mapReadings(table, base)).toThrow('The file has no column called "Weight"');
    expect(() => mapReadings(table, { ...base, temperatureColumn: null, weightColumn: null })).toThrow('Choose a temperature column');
  });

  it('reports short rows, bad times, missing values and logger fault markers with their line numbers, and keeps the rest', () => {
    const csv = [
      'Time,Temp,Weight',
      '2026-05-01 10:00,34.5,40.2', // 2 ok
      '2026-05-01 11:00,34.6', // 3 short
      'yesterday,34.7,40.4', // 4 bad time
      '2026-05-01 13:00,,', // 5 no values
      '2026-05-01 14:00,-999,40.6', // 6 fault marker
      '', // 7 blank: not a row
      '2026-02-30 15:00,34.8,40.7', // 8 no such day
      '2026-05-01 16:00,,40.8', // 9 ok, weight only
      '2026-05-01 10:00,34.9,40.9', // 10 repeats line 2's time
    ].join('\n');
    const out = mapReadings(readCsv(csv), base);
    expect(out.readings).toHaveLength(2);
    expect(out.bad.map((b) => b.line)).toEqual([3, 4, 5, 6, 8]);
    expect(out.bad[0].reason).toBe('has 2 fields, the mapped columns need 3');
    expect(out.bad[2].reason).toBe('has no temperature or weight');
    expect(out.bad[3].reason).toMatch(/outside -40 to 70 °C/);
    expect(out.bad[4].reason).toMatch(/day 30 is not in that month/);
    expect(out.repeated).toEqual([{ line: 10, reason: 'repeats the time 2026-05-01T10:00:00.000Z' }]);
    expect(out.rows).toBe(8);
  });

  it('reports a row with an unbalanced quote instead of dropping it', () => {
    const out = mapReadings(readCsv('Time,Temp\n2026-05-01 10:00,34.5\n2026-05-01 11:00,"34.6\n'), { ...base, weightColumn: null });
    expect(out.readings).toHaveLength(1);
    expect(out.bad).toHaveLength(1);
    expect(out.bad[0].line).toBe(3);
  });

  it('converts °F and lb (exact definitions)', () => {
    const out = mapReadings(readCsv('Time,Temp (F),Weight lbs\n2026-05-01 10:00,95,100\n'), {
      ...base,
      temperatureColumn: 'Temp (F)',
      weightColumn: 'Weight lbs',
      temperatureUnit: 'F',
      weightUnit: 'lb',
    });
    expect(suggestColumns(['Time', 'Temp (F)', 'Weight lbs'])).toMatchObject({ temperatureUnit: 'F', weightUnit: 'lb' });
    expect(out.readings[0].temperatureC).toBeCloseTo(35, 10);
    expect(out.readings[0].weightKg).toBeCloseTo(45.359237, 10);
  });

  it.each([
    ['21.5', 21.5],
    ['21,5', 21.5],
    ['-0,25', -0.25],
    ['', null],
    ['1.234,5', NaN],
    ['abc', NaN],
  ])('parseDecimal(%j) = %p', (input, expected) => {
    const v = parseDecimal(input);
    if (expected === null) expect(v).toBeNull();
    else if (Number.isNaN(expected)) expect(v).toBeNaN();
    else expect(v).toBe(expected);
  });
});

describe('logger times and time zones', () => {
  it.each([
    // Europe/London is UTC+1 in summer (BST) and UTC+0 in winter: IANA tz database.
    ['2026-07-01 12:00', 'iso', 'Europe/London', '2026-07-01T11:00:00.000Z'],
    ['2026-01-15 12:00', 'iso', 'Europe/London', '2026-01-15T12:00:00.000Z'],
    ['2026-07-01T12:00:00+02:00', 'iso', 'Europe/London', '2026-07-01T10:00:00.000Z'],
    ['07/01/2026 2:30 PM', 'mdy', 'America/New_York', '2026-07-01T18:30:00.000Z'],
    ['31/12/2026 23:59:59', 'dmy', 'UTC', '2026-12-31T23:59:59.000Z'],
    ['1777636800', 'epoch-s', 'UTC', '2026-05-01T12:00:00.000Z'],
    ['1777636800000', 'epoch-ms', 'Pacific/Auckland', '2026-05-01T12:00:00.000Z'],
  ] as const)('%s (%s, %s) is %s', (field, format, zone, expected) => {
    const ms = parseLoggerTime(field, format, zone);
    expect(typeof ms).toBe('number');
    expect(new Date(ms as number).toISOString()).toBe(expected);
  });

  it('takes the offset before the change inside the spring-forward gap (Europe/London, 29 March 2026, 01:00–02:00 missing)', () => {
    expect(new Date(zonedTimeToUtc(Date.UTC(2026, 2, 29, 1, 30), 'Europe/London')).toISOString()).toBe('2026-03-29T01:30:00.000Z');
  });

  it('explains a time it cannot read', () => {
    expect(parseLoggerTime('13/13/2026', 'dmy', 'UTC')).toMatch(/month 13/);
    expect(parseLoggerTime('', 'iso', 'UTC')).toBe('the time is empty');
  });
});

describe('100,000 rows', () => {
  it('are read and mapped well within 20 s (measured, printed)', () => {
    const lines = ['"Date/Time";"Brood temp °C";"Hive weight kg"'];
    const start = Date.UTC(2026, 2, 1);
    for (let i = 0; i < 100_000; i++) {
      const d = new Date(start + i * 5 * 60_000);
      const stamp = `${String(d.getUTCDate()).padStart(2, '0')}.${String(d.getUTCMonth() + 1).padStart(2, '0')}.${d.getUTCFullYear()} ${String(d.getUTCHours()).padStart(2, '0')}:${String(d.getUTCMinutes()).padStart(2, '0')}`;
      lines.push(`${stamp};${(34 + (i % 10) / 10).toFixed(1).replace('.', ',')};${(40 + (i % 100) / 100).toFixed(2).replace('.', ',')}`);
    }
    const csv = lines.join('\n');
    const t0 = performance.now();
    const table = readCsv(csv);
    const out = mapReadings(table, {
      timeColumn: 'Date/Time',
      temperatureColumn: 'Brood temp °C',
      weightColumn: 'Hive weight kg',
      timeFormat: 'dmy',
      temperatureUnit: 'C',
      weightUnit: 'kg',
      timeZone: 'Europe/Berlin',
    });
    const ms = performance.now() - t0;
    // eslint-disable-next-line no-console
    console.log(`sensor-csv: parsed and mapped 100,000 rows (${(csv.length / 1e6).toFixed(1)} MB) in ${ms.toFixed(0)} ms`);
    // The generated wall times run through the spring-forward gap (Europe/Berlin, 29 March 2026,
    // 02:00–03:00 does not exist): those 12 five-minute rows land on the same instants as the
    // 12 after 03:00 and are reported as repeats; none is lost silently.
    expect(out.bad).toEqual([]);
    expect(out.repeated).toHaveLength(12);
    expect(out.readings.length + out.repeated.length).toBe(100_000);
    expect(ms).toBeLessThan(20_000);
  });
});
