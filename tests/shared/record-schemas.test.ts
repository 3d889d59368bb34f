/** The record schemas the forms and the API share (shared/schemas/records.ts). */
import { RECORD_KIND_PATHS, RECORD_LIMITS, recordSchemas } from '../../shared/schemas/records';

const now = new Date('2026-06-15T12:00:00Z');
const s = recordSchemas(() => now);

describe('record schemas', () => {
  it('fills a Quick check’s defaults, with the visit time now', () => {
    const v = s.inspection.create.parse({ framesBrood: 4.5, framesBees: 8, queenStatus: 'eggs-seen', eggsSeen: true });
    expect(v).toMatchObject({ occurredAt: now.toISOString(), honeyFrames: 0, queenCells: [], diseaseSigns: [], note: '', temperament: null });
  });

  it.each([
    [{ occurredAt: '2026-06-16T11:59:00Z' }, true],
    [{ occurredAt: '2026-06-16T12:01:00Z' }, false],
    [{ occurredAt: 'yesterday' }, false],
  ])('allows a visit at most a day ahead: %j → %s', (over, ok) => {
    expect(s.inspection.create.safeParse({ framesBrood: 1, framesBees: 2, queenStatus: 'queen-seen', ...over }).success).toBe(ok);
  });

  it('takes a wash without a bee count as the standard 300-bee sample (Lee et al. 2010; Oliver 2020; TRADE-REFERENCES §3)', () => {
    expect(RECORD_LIMITS.defaultBeesSampled).toBe(300);
    expect(s['mite-count'].create.parse({ method: 'sugar-roll', mites: 6 }).beesSampled).toBe(300);
    expect(s['mite-count'].create.parse({ method: 'sticky-board', mites: 6, days: 3 }).beesSampled).toBeNull();
  });

  it.each([
    [20, 'dearth'],
    [30, 'dearth'],
    [31, 'some'],
  ])('judges a dish emptied in %i min as %s (≤ 30 min = dearth: common practice, TRADE-REFERENCES §9)', (minutes, judgement) => {
    expect(s['forage-check'].create.parse({ minutesToEmpty: minutes }).judgement).toBe(judgement);
  });

  it('keeps the keeper’s own judgement over the dish, and needs one of the two', () => {
    expect(s['forage-check'].create.parse({ minutesToEmpty: 20, judgement: 'some' }).judgement).toBe('some');
    expect(s['forage-check'].create.safeParse({}).success).toBe(false);
    expect(s['forage-check'].create.safeParse({ untouched: true, watchedMinutes: 10 }).success).toBe(false);
  });

  it('lets an edit carry any subset of fields, but always the version', () => {
    expect(s.harvest.update.safeParse({ version: 3, weightKg: 12 }).success).toBe(true);
    expect(s.harvest.update.safeParse({ weightKg: 12 }).success).toBe(false);
    expect(s.harvest.update.safeParse({ version: 3, colour: 'gold' }).success).toBe(false);
    // No defaults sneak into an edit.
    expect(s.inspection.update.parse({ version: 1 })).toEqual({ version: 1 });
  });

  it('names a URL segment for every kind', () => {
    expect(RECORD_KIND_PATHS).toEqual({
      inspection: 'inspections',
      feeding: 'feedings',
      treatment: 'treatments',
      'mite-count': 'mite-counts',
      harvest: 'harvests',
      'queen-event': 'queen-events',
      'colony-event': 'colony-events',
      'forage-check': 'forage-checks',
    });
  });
});
