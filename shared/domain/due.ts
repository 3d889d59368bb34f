/**
 * The Due list's rules: tasks derived from a hive's records and the calendar. Pure: `today`
 * comes in, nothing is stored. Each task's `key` is stable across derivations (rule + hive +
 * the record or period it comes from), so the server can match it to a saved done / snoozed /
 * dismissed state. Sources: TRADE-REFERENCES §1, §3, §4, §6, §9; each rule names its own.
 */

import { addDays, addMonths, compareDates, diffDays, monthOf, type IsoDate } from './dates';
import type { Box, Hemisphere, HiveStatus } from './hives';
import { miteLoad } from './mites';
import type {
  FeedingRecord,
  HiveRecords,
  InspectionRecord,
  QueenEventKind,
  TreatmentActiveIngredient,
  TreatmentRecord,
} from './records';
import { feedPlan, SUGAR_KG_PER_HONEY_KG } from './stores';
import { mixSyrup } from './syrup';

export const SEASONS = ['build-up', 'swarm', 'late-season', 'winter'] as const;
export type Season = (typeof SEASONS)[number];

/**
 * The beekeeping season of a date, temperate climate. Northern months: March build-up;
 * April–July swarm season (§9: UK May–July, "broadly Mar/Apr–Jul depending on latitude",
 * Trunch BKA, confirmed secondary; April taken so early colonies are covered); August–October
 * late season, when winter stores are made up (Moeller 1977: fall feeding done by ~15 Oct, §6);
 * November–February winter (Frameside's own choice, common practice). The southern hemisphere
 * runs six months later (swarm season October–January).
 */
export function seasonOf(date: IsoDate, hemisphere: Hemisphere): Season {
  if (hemisphere !== 'north' && hemisphere !== 'south') throw new RangeError(`Hemisphere is north or south, got ${String(hemisphere)}.`);
  const m = monthOf(date);
  const northMonth = hemisphere === 'north' ? m : ((m + 5) % 12) + 1;
  if (northMonth === 3) return 'build-up';
  if (northMonth >= 4 && northMonth <= 7) return 'swarm';
  if (northMonth >= 8 && northMonth <= 10) return 'late-season';
  return 'winter';
}

/** Intervals in days the rules use, each with its source. */
export const DUE_INTERVALS = {
  /** Swarm season: weekly, since a colony goes from no cells to sealed cells in ~8–9 d (§9, Trunch BKA / textbooks, confirmed secondary). */
  swarmSeasonInspectionDays: 7,
  /** Outside swarm season: fortnightly (§9 "less often in summer/autumn"; 14 d is common practice, the outer end of the 7–14 d round). */
  inspectionDays: 14,
  /** Capped swarm cells: visit within 5–7 d; 5 is §9's interval "when swarm risk is high" (Trunch BKA, confirmed secondary). */
  queenCellsVisitDays: 5,
  /** A queen emerges ~8 d after her cell is sealed (§1, W. Shaw / Welsh BKA, confirmed secondary). */
  queenEmergesAfterCappingDays: 8,
  /** Look for the new queen's eggs ~3 weeks after emergence (§1, BBKA via Trunch BKA: 14–21 d, worry after ~3 weeks). */
  layingCheckAfterEmergenceDays: 21,
  /** Caged queen: check release after 3–5 d; the first day of the window (§1, Britannica; BEE-L 1997, confirmed secondary). */
  releaseCheckDays: 3,
  /** Released queen: look for eggs about a week later (§1, BEE-L 1997 "In about a week", confirmed secondary). */
  eggsCheckAfterReleaseDays: 7,
  /** No eggs or brood: look again in a week; eggs hatch on day 3 (§1), so a laying queen shows eggs and young larvae by then. Common practice. */
  queenlessRecheckDays: 7,
  /** Mite recount 10–14 d after a treatment ends; the first day of the window (§3, retailer instructions, confirmed secondary). */
  miteRecountAfterEndDays: 10,
  /** Syrup feeder: check 3 d after feeding (3–7 d window, common practice; syrup goes fastest). */
  syrupRefillCheckDays: 3,
  /** Fondant, patties and other solid feed: check 7 d after (the same 3–7 d common-practice window; solid feed lasts longer). */
  solidFeedCheckDays: 7,
  /** Late-season stores estimate counts for the current feeding window if no older than this (one late season, Aug–Oct). Frameside's own choice. */
  storesEstimateMaxAgeDays: 92,
} as const;

export interface TreatmentDefault {
  /** Typical length of one round, days from start; null when only the label can say. 0 = a single application. */
  durationDays: number | null;
  /** Whether honey supers may stay on during treatment; null when only the label can say. */
  supersAllowed: boolean | null;
  /** Days after the end before supers for harvest go back on; null when only the label can say. */
  resuperAfterDays: number | null;
  /** Daytime temperature range for application, °C, where §4 gives one. */
  temperatureC?: { min: number; max: number };
  /** Always true: the label (US) or SPC (UK/EU) is the legal instruction; these only fill gaps in a record. */
  checkTheLabel: true;
  /** Where each value comes from, and how sure it is. */
  sources: { durationDays: string; supersAllowed: string; resuperAfterDays: string; temperatureC?: string };
}

/**
 * Defaults by active ingredient, used only when a treatment record leaves a date out.
 * TRADE-REFERENCES §4; the label governs, and a dated entry on the record always wins.
 */
export const TREATMENT_DEFAULTS: Readonly<Record<TreatmentActiveIngredient, TreatmentDefault>> = {
  'oxalic-acid': {
    durationDays: 0,
    supersAllowed: false,
    resuperAfterDays: 0,
    checkTheLabel: true,
    sources: {
      durationDays:
        'Dribble: one application ("best done in a single treatment", Oliver / retailer label recipe, confirmed secondary). Vaporisation series of 3–4 doses 5–7 d apart: from memory; enter them as the record’s schedule from the label.',
      supersAllowed:
        'US: supers only once the amended or supplemental label is on the product (EPA, confirmed secondary); many SPCs forbid use in a flow. Supers off unless the label says otherwise.',
      resuperAfterDays: 'EU/UK SPCs often state "Honey: zero days": from memory, not confirmed. Check the label.',
    },
  },
  'formic-acid': {
    durationDays: 14,
    supersAllowed: true,
    resuperAfterDays: 0,
    temperatureC: { min: 10, max: 30 },
    checkTheLabel: true,
    sources: {
      durationDays: 'One application of 7–14 d, or two 10 d apart, product-specific: from memory (§4). 14 d is the long end.',
      supersAllowed: '"Safe for use with honey supers on the hive" (Oliver ABJ 2022 / retailer FAQ, confirmed secondary).',
      resuperAfterDays: 'Supers may stay on, no withdrawal per US labels: from memory, not confirmed.',
      temperatureC: 'Daytime highs 10–30 °C on application (Oliver ABJ Sept 2022, confirmed secondary); ≥ 33 °C in the first 3 days risks queen and brood.',
    },
  },
  thymol: {
    durationDays: 42,
    supersAllowed: false,
    resuperAfterDays: null,
    temperatureC: { min: 15, max: 30 },
    checkTheLabel: true,
    sources: {
      durationDays: 'Exposure of six to eight weeks (EU thymol-strip label summary; Oliver ABJ Nov 2022, confirmed secondary); 42 d is the short end.',
      supersAllowed: '"Remove all honey supers" (EU thymol-strip label summary, confirmed secondary).',
      resuperAfterDays: 'No figure in TRADE-REFERENCES: take the withdrawal from the label.',
      temperatureC: 'Reduced efficacy below 15 °C; do not apply above 30 °C (EU thymol-strip label summary, confirmed secondary).',
    },
  },
  amitraz: {
    durationDays: 42,
    supersAllowed: false,
    resuperAfterDays: 14,
    checkTheLabel: true,
    sources: {
      durationDays: 'Strips in for 6–8 weeks, then removed (retailer FAQ, confirmed secondary); 42 d is the short end.',
      supersAllowed: 'Supers off during treatment: from memory, not confirmed.',
      resuperAfterDays: 'Re-super ≥ 14 d after strip removal: from memory, not confirmed.',
    },
  },
  'hop-beta-acids': {
    durationDays: 30,
    supersAllowed: true,
    resuperAfterDays: 0,
    checkTheLabel: true,
    sources: {
      durationDays: 'Repeat applications at ~30-day or shorter intervals, label-specific: from memory.',
      supersAllowed: 'Approved while bees store honey for harvest (Oliver ABJ Feb 2022; UC Davis Extension, confirmed secondary).',
      resuperAfterDays: 'Supers may stay on, no withdrawal per US labels: from memory, not confirmed.',
    },
  },
  other: {
    durationDays: null,
    supersAllowed: null,
    resuperAfterDays: null,
    checkTheLabel: true,
    sources: {
      durationDays: 'Unknown ingredient: from the label.',
      supersAllowed: 'Unknown ingredient: from the label.',
      resuperAfterDays: 'Unknown ingredient: from the label.',
    },
  },
};

export const DUE_RULES = [
  'next-inspection',
  'winter-heft',
  'queen-cells-visit',
  'new-queen-laying-check',
  'queen-release-check',
  'queen-eggs-check',
  'queenless-recheck',
  'treatment-step',
  'treatment-end',
  'mite-recount',
  'supers-back-on',
  'feeder-refill',
  'winter-feed',
  'treat-varroa',
] as const;
export type DueRule = (typeof DUE_RULES)[number];

export interface DerivedTask {
  rule: DueRule;
  hiveId: string;
  apiaryId: string;
  title: string;
  /** Why the task exists, in plain words. */
  reason: string;
  dueDate: IsoDate;
  /** The published source or practice the rule rests on. */
  source: string;
  sourceRecordId?: string;
  /** Stable across derivations: rule:hiveId:record-or-period. */
  key: string;
}

export interface DeriveTasksInput {
  today: IsoDate;
  hemisphere: Hemisphere;
  apiary: { id: string; winterTargetKg?: number | null };
  hive: { id: string; name: string; boxes: readonly Box[]; status?: HiveStatus };
  records: HiveRecords;
}

const INGREDIENT_WORDS: Readonly<Record<TreatmentActiveIngredient, string>> = {
  'oxalic-acid': 'oxalic acid',
  'formic-acid': 'formic acid',
  thymol: 'thymol',
  amitraz: 'amitraz',
  'hop-beta-acids': 'hop beta acids',
  other: 'varroa',
};

/** The latest record by date; among records on the same day, the one listed last. */
function latest<T extends { date: IsoDate }>(records: readonly T[]): T | undefined {
  let best: T | undefined;
  for (const r of records) if (!best || compareDates(r.date, best.date) >= 0) best = r;
  return best;
}

const after = (date: IsoDate, than: IsoDate) => compareDates(date, than) > 0;
const onOrAfter = (date: IsoDate, than: IsoDate) => compareDates(date, than) >= 0;
const showsEggs = (i: InspectionRecord) => i.eggsSeen || i.queenStatus === 'eggs-seen';
const hasCapped = (i: InspectionRecord, kind?: string) => i.queenCells.some((c) => c.capped && c.count > 0 && (!kind || c.kind === kind));

/** Queen events that mean the keeper has taken the colony's queen question into their own hands. */
const QUEEN_TAKEN_IN_HAND: readonly QueenEventKind[] = ['introduced-caged', 'released', 'replaced'];

function round1(x: number): number {
  return Math.round(x * 10) / 10;
}

/**
 * Tasks due for one hive on `today` from its records: next inspection by season and hemisphere
 * (or a monthly heft in winter), capped queen cells, queen introduction, queenlessness,
 * treatment steps and ends, mite recount, supers back on, feeder refill, winter feed and a
 * treatment after an 'act' mite count. Returns [] for a hive that is not active. Records that
 * cannot be read (e.g. a mite count with no bees) are skipped, not thrown: one bad record must
 * not empty a keeper's Due list; the forms' schemas reject them at entry.
 */
export function deriveTasks(input: DeriveTasksInput): DerivedTask[] {
  const { today, hemisphere, apiary, hive } = input;
  if (hive.status && hive.status !== 'active') return [];
  const inspections = input.records.inspections ?? [];
  const feedings = input.records.feedings ?? [];
  const treatments = input.records.treatments ?? [];
  const miteCounts = input.records.miteCounts ?? [];
  const queenEvents = input.records.queenEvents ?? [];
  const storesEstimates = input.records.storesEstimates ?? [];

  const tasks: DerivedTask[] = [];
  const add = (t: Omit<DerivedTask, 'hiveId' | 'apiaryId' | 'key'> & { keyPart: string }) => {
    const { keyPart, ...rest } = t;
    tasks.push({ ...rest, hiveId: hive.id, apiaryId: apiary.id, key: `${t.rule}:${hive.id}:${keyPart}` });
  };
  const I = DUE_INTERVALS;
  const lastInspection = latest(inspections);

  // Capped swarm cells on the latest visit: go back before a virgin can emerge (~8 d after sealing).
  let cellsVisitDue = false;
  if (lastInspection && hasCapped(lastInspection, 'swarm')) {
    cellsVisitDue = true;
    add({
      rule: 'queen-cells-visit',
      title: `Check the capped swarm cells: ${hive.name}`,
      reason: `Capped swarm cells were seen on ${lastInspection.date}. A virgin queen can emerge about 8 days after a cell is sealed, so look again within 5–7 days.`,
      dueDate: addDays(lastInspection.date, I.queenCellsVisitDays),
      source: 'TRADE-REFERENCES §9 (Trunch BKA: 5-day visits when swarm risk is high) and §1 (W. Shaw, Welsh BKA: emergence 8 days after sealing)',
      sourceRecordId: lastInspection.id,
      keyPart: lastInspection.id,
    });
  }

  // Next routine visit. Skipped while a queen-cell visit is due: that visit comes first and is the visit.
  if (!cellsVisitDue) {
    if (!lastInspection) {
      add({
        rule: 'next-inspection',
        title: `First Quick check: ${hive.name}`,
        reason: 'No Quick check has been recorded for this hive yet.',
        dueDate: today,
        source: 'Frameside: a hive needs one check before its rounds can be planned',
        keyPart: 'none',
      });
    } else {
      const base = lastInspection.date;
      const season = seasonOf(base, hemisphere);
      const weekly = addDays(base, I.swarmSeasonInspectionDays);
      const fortnightly = addDays(base, I.inspectionDays);
      // Once winter has come, a visit left over from the autumn becomes a heft: the cluster stays closed.
      const winterNow = seasonOf(today, hemisphere) === 'winter';
      if (!winterNow && seasonOf(weekly, hemisphere) === 'swarm') {
        add({
          rule: 'next-inspection',
          title: `Quick check: ${hive.name}`,
          reason: `Swarm season: a colony can go from no queen cells to sealed cells in 8–9 days, so check every 7 days (last check ${base}).`,
          dueDate: weekly,
          source: 'TRADE-REFERENCES §9 (Trunch BKA; textbooks: one inspection a week in swarm season)',
          sourceRecordId: lastInspection.id,
          keyPart: lastInspection.id,
        });
      } else if (!winterNow && season !== 'winter' && seasonOf(fortnightly, hemisphere) !== 'winter') {
        add({
          rule: 'next-inspection',
          title: `Quick check: ${hive.name}`,
          reason: `Outside swarm season a check every 14 days is enough (last check ${base}).`,
          dueDate: fortnightly,
          source: 'TRADE-REFERENCES §9 (fewer inspections outside swarm season); 14 days: common practice',
          sourceRecordId: lastInspection.id,
          keyPart: lastInspection.id,
        });
      } else {
        // Winter: no opening, only a monthly heft or weighing, counted from the last check or stores estimate.
        const lastEstimate = latest(storesEstimates);
        const useEstimate = lastEstimate !== undefined && after(lastEstimate.date, base);
        const heftBase = useEstimate ? lastEstimate.date : base;
        const heftRecordId = useEstimate ? lastEstimate.id : lastInspection.id;
        const due = addMonths(heftBase, 1);
        const stillWinter = seasonOf(due, hemisphere) === 'winter' || (winterNow && compareDates(due, today) <= 0);
        add({
          rule: stillWinter ? 'winter-heft' : 'next-inspection',
          title: stillWinter ? `Heft or weigh: ${hive.name}` : `First spring Quick check: ${hive.name}`,
          reason: stillWinter
            ? `Winter: leave the cluster closed and heft or weigh the hive once a month to follow its stores (last ${heftBase}).`
            : `Winter is ending: a month after the last winter check (${heftBase}), open for the first full check.`,
          dueDate: due,
          source: 'Frameside’s own choice (common practice): monthly winter heft, November–February in the north',
          sourceRecordId: heftRecordId,
          keyPart: heftRecordId,
        });
      }
    }
  }

  // A new queen from capped cells of any kind: look for her eggs ~3 weeks after she emerges.
  const lastCapped = latest(inspections.filter((i) => hasCapped(i)));
  let layingCheckPending = false;
  if (lastCapped) {
    const later = inspections.filter((i) => after(i.date, lastCapped.date));
    const resolved =
      later.some(showsEggs) ||
      queenEvents.some((e) => after(e.date, lastCapped.date) && (e.kind === 'introduced-caged' || e.kind === 'replaced'));
    if (!resolved) {
      layingCheckPending = true;
      const emerges = addDays(lastCapped.date, I.queenEmergesAfterCappingDays);
      add({
        rule: 'new-queen-laying-check',
        title: `Look for the new queen’s eggs: ${hive.name}`,
        reason: `Capped queen cells were seen on ${lastCapped.date}; the queen should have emerged by about ${emerges}. A new queen usually lays within 2–3 weeks of emerging; worry if there are no eggs after 3 weeks.`,
        dueDate: addDays(emerges, I.layingCheckAfterEmergenceDays),
        source: 'TRADE-REFERENCES §1 (W. Shaw, Welsh BKA: emergence 8 days after sealing; BBKA via Trunch BKA: laying 14–21 days after emergence)',
        sourceRecordId: lastCapped.id,
        keyPart: lastCapped.id,
      });
    }
  }

  // A caged queen: release check, then an eggs check a week after release.
  const introduced = latest(queenEvents.filter((e) => e.kind === 'introduced-caged'));
  if (introduced) {
    const lostSince = queenEvents.some((e) => after(e.date, introduced.date) && e.kind === 'lost');
    const released = queenEvents.find((e) => e.kind === 'released' && onOrAfter(e.date, introduced.date));
    const eggsSince = (d: IsoDate) => inspections.some((i) => after(i.date, d) && showsEggs(i));
    if (!lostSince && !released && !eggsSince(introduced.date)) {
      add({
        rule: 'queen-release-check',
        title: `Check the caged queen is out: ${hive.name}`,
        reason: `A caged queen went in on ${introduced.date}. After 3–5 days the candy is usually gone; release her by hand if she is still caged and the workers are calm.`,
        dueDate: addDays(introduced.date, I.releaseCheckDays),
        source: 'TRADE-REFERENCES §1 (Britannica, "Requeening a colony"; BEE-L 1997)',
        sourceRecordId: introduced.id,
        keyPart: introduced.id,
      });
    }
    if (!lostSince && released && !eggsSince(released.date)) {
      add({
        rule: 'queen-eggs-check',
        title: `Look for the new queen’s eggs: ${hive.name}`,
        reason: `The queen was released on ${released.date}. About a week later there should be fresh eggs and young larvae.`,
        dueDate: addDays(released.date, I.eggsCheckAfterReleaseDays),
        source: 'TRADE-REFERENCES §1 (BEE-L 1997: "In about a week, look to see if there are fresh eggs and larvae")',
        sourceRecordId: released.id,
        keyPart: released.id,
      });
    }
  }

  // No eggs or brood, or a queen recorded lost: look again in a week.
  const lastQueenLost = latest(queenEvents.filter((e) => e.kind === 'lost'));
  const handledAfter = (d: IsoDate) => queenEvents.some((e) => after(e.date, d) && QUEEN_TAKEN_IN_HAND.includes(e.kind));
  if (
    lastInspection &&
    lastInspection.queenStatus === 'no-eggs-or-brood' &&
    // While a queen from capped cells is due to start laying, no eggs is expected; the laying check covers it.
    !layingCheckPending &&
    !handledAfter(lastInspection.date) &&
    !(lastQueenLost && after(lastQueenLost.date, lastInspection.date))
  ) {
    add({
      rule: 'queenless-recheck',
      title: `Look again for eggs: ${hive.name}`,
      reason: `No eggs or brood were seen on ${lastInspection.date}. Eggs hatch on day 3, so a week shows whether a queen is laying.`,
      dueDate: addDays(lastInspection.date, I.queenlessRecheckDays),
      source: 'Common practice; TRADE-REFERENCES §1 (egg hatches on day 3)',
      sourceRecordId: lastInspection.id,
      keyPart: lastInspection.id,
    });
  } else if (
    lastQueenLost &&
    (!lastInspection || after(lastQueenLost.date, lastInspection.date)) &&
    !handledAfter(lastQueenLost.date)
  ) {
    add({
      rule: 'queenless-recheck',
      title: `Check the colony after losing its queen: ${hive.name}`,
      reason: `The queen was recorded lost on ${lastQueenLost.date}. Look in a week for eggs, young larvae or emergency cells.`,
      dueDate: addDays(lastQueenLost.date, I.queenlessRecheckDays),
      source: 'Common practice; TRADE-REFERENCES §1 (egg hatches on day 3)',
      sourceRecordId: lastQueenLost.id,
      keyPart: lastQueenLost.id,
    });
  }

  for (const t of treatments) addTreatmentTasks(t);

  function addTreatmentTasks(t: TreatmentRecord) {
    const d = TREATMENT_DEFAULTS[t.activeIngredient] ?? TREATMENT_DEFAULTS.other;
    const what = INGREDIENT_WORDS[t.activeIngredient] ?? 'varroa';
    const defaultEnd = d.durationDays === null ? undefined : addDays(t.startDate, d.durationDays);
    const end = t.actualEndDate ?? t.plannedEndDate ?? defaultEnd;
    const label = 'check the label (the label or SPC is the legal instruction)';

    if (!t.actualEndDate) {
      const steps = [...new Set([...(t.schedule ?? []), ...(t.nextStepDate ? [t.nextStepDate] : [])])]
        .filter((s) => after(s, t.startDate))
        .sort(compareDates);
      for (const step of steps) {
        add({
          rule: 'treatment-step',
          title: `Next ${what} step: ${hive.name}`,
          reason: `The ${what} treatment started on ${t.startDate} has a step planned for ${step} (repeat dose or strip change); ${label}.`,
          dueDate: step,
          source: 'The treatment record’s own schedule, from the product label (TRADE-REFERENCES §4: the label governs)',
          sourceRecordId: t.id,
          keyPart: `${t.id}:${step}`,
        });
      }
      if (end && after(end, t.startDate)) {
        add({
          rule: 'treatment-end',
          title: `End the ${what} treatment: ${hive.name}`,
          reason: t.plannedEndDate
            ? `The ${what} treatment started on ${t.startDate} is planned to end on ${end}; remove strips or pads and record the end.`
            : `No end date was recorded; ${what} rounds typically last ${d.durationDays} days. ${capitalise(label)}.`,
          dueDate: end,
          source: t.plannedEndDate ? 'The treatment record’s planned end (from the label)' : `TREATMENT_DEFAULTS: ${d.sources.durationDays}`,
          sourceRecordId: t.id,
          keyPart: t.id,
        });
      }
    }

    if (end) {
      const counted = miteCounts.some((c) => after(c.date, end));
      if (!counted) {
        add({
          rule: 'mite-recount',
          title: `Count mites after the ${what} treatment: ${hive.name}`,
          reason: `Wash or roll again 10–14 days after the treatment ends (${end}) to see whether it worked.`,
          dueDate: addDays(end, I.miteRecountAfterEndDays),
          source: 'TRADE-REFERENCES §3 (re-test 10–14 days post-treatment, retailer instructions)',
          sourceRecordId: t.id,
          keyPart: t.id,
        });
      }
    }

    if (t.supersOff) {
      const resuper = t.withdrawalUntil ?? (end && d.resuperAfterDays !== null ? addDays(end, d.resuperAfterDays) : end);
      const superAdded = inspections.some((i) => after(i.date, t.startDate) && i.spaceActions.includes('super-added'));
      // Supers do not go back on in winter (nor once winter has come): the spring rounds will put them on.
      if (resuper && !superAdded && seasonOf(resuper, hemisphere) !== 'winter' && seasonOf(today, hemisphere) !== 'winter') {
        add({
          rule: 'supers-back-on',
          title: `Supers may go back on: ${hive.name}`,
          reason: t.withdrawalUntil
            ? `Supers came off for the ${what} treatment; the withdrawal period recorded from the label ends on ${t.withdrawalUntil}.`
            : d.resuperAfterDays === null
              ? `Supers came off for the ${what} treatment, which ends on ${end}. No withdrawal period was recorded: check the label before supers go back on.`
              : `Supers came off for the ${what} treatment; by default they go back ${d.resuperAfterDays} days after it ends (${end}). Check the label.`,
          dueDate: resuper,
          source: t.withdrawalUntil ? 'The treatment record’s withdrawal date (from the label)' : `TREATMENT_DEFAULTS: ${d.sources.resuperAfterDays}`,
          sourceRecordId: t.id,
          keyPart: t.id,
        });
      }
    }
  }

  // Feeder refill: check the feeder a few days after the last feeding.
  const lastFeeding = latest(feedings);
  if (lastFeeding) {
    const lookedSince = inspections.some((i) => after(i.date, lastFeeding.date));
    if (!lookedSince) {
      const syrup = lastFeeding.kind === 'syrup';
      add({
        rule: 'feeder-refill',
        title: `Check the feeder: ${hive.name}`,
        reason: syrup
          ? `Syrup went on on ${lastFeeding.date}; see whether it is taken and needs a refill.`
          : `Feed went on on ${lastFeeding.date}; see whether it is taken and needs topping up.`,
        dueDate: addDays(lastFeeding.date, syrup ? I.syrupRefillCheckDays : I.solidFeedCheckDays),
        source: 'Common practice: check a feeder 3–7 days after feeding',
        sourceRecordId: lastFeeding.id,
        keyPart: lastFeeding.id,
      });
    }
  }

  // Winter stores shortfall in the late season, made up with 2:1 syrup.
  const target = apiary.winterTargetKg;
  if (target && target > 0 && seasonOf(today, hemisphere) === 'late-season') {
    const estimate = latest(storesEstimates);
    if (
      estimate &&
      seasonOf(estimate.date, hemisphere) === 'late-season' &&
      diffDays(estimate.date, today) >= 0 &&
      diffDays(estimate.date, today) <= I.storesEstimateMaxAgeDays
    ) {
      const fedKg = feedings.filter((f) => after(f.date, estimate.date)).reduce((kg, f) => kg + honeyEquivalentKg(f), 0);
      const storesKg = estimate.storesKg + fedKg;
      if (storesKg < target) {
        const plan = feedPlan({ storesKg, targetKg: target, ratio: '2:1' });
        const fedNote = fedKg > 0 ? ` (${round1(estimate.storesKg)} kg estimated on ${estimate.date}, plus about ${round1(fedKg)} kg from syrup fed since)` : ` (estimated on ${estimate.date})`;
        add({
          rule: 'winter-feed',
          title: `Feed about ${round1(plan.syrupL)} L of 2:1 syrup: ${hive.name}`,
          reason:
            `Stores are about ${round1(storesKg)} kg${fedNote}, ${round1(plan.shortfallKg)} kg short of the ${round1(target)} kg winter target. ` +
            `That is about ${round1(plan.sugarKg)} kg sugar in ${round1(plan.waterL)} L water (2:1 by weight). Feed inside the hive, in the evening if robbing is likely, and finish before it turns cold.`,
          dueDate: estimate.date,
          source:
            'TRADE-REFERENCES §2b (2:1 by weight for autumn stores, Moeller 1977; evening feeding, Phillips 1919), §6 (complete fall feeding by ~15 Oct, Moeller 1977); 0.8 kg sugar per kg honey: Frameside’s own assumption',
          sourceRecordId: estimate.id,
          keyPart: estimate.id,
        });
      }
    }
  }

  // A mite count at the 'act' level with no treatment started since.
  const lastCount = latest(miteCounts);
  if (lastCount) {
    let load: ReturnType<typeof miteLoad> | undefined;
    try {
      load = miteLoad({ method: lastCount.method, mites: lastCount.mites, beesSampled: lastCount.beesSampled, days: lastCount.days });
    } catch {
      load = undefined;
    }
    const treatedSince = treatments.some((t) => onOrAfter(t.startDate, lastCount.date));
    if (load && load.level === 'act' && !treatedSince) {
      const figure =
        load.perHundredBees !== undefined ? `${round1(load.perHundredBees)} mites per 100 bees` : `${round1(load.perDay ?? 0)} mites a day`;
      add({
        rule: 'treat-varroa',
        title: `Plan a varroa treatment: ${hive.name}`,
        reason: `The mite count on ${lastCount.date} found ${figure}. ${load.basis} Choose a treatment whose label fits the season and whether supers are on.`,
        dueDate: lastCount.date,
        source: 'TRADE-REFERENCES §3 (USDA-ARS Tucson and University of Florida: treat at 3 mites per 100 bees, or above 30 a day on a sticky board)',
        sourceRecordId: lastCount.id,
        keyPart: lastCount.id,
      });
    }
  }

  return tasks;
}

/** Honey-equivalent kg of stores a syrup feeding adds (sugar ÷ 0.8); 0 for solid feed or a syrup whose ratio or volume is not recorded. */
function honeyEquivalentKg(f: FeedingRecord): number {
  if (f.kind !== 'syrup' || (f.ratio !== '1:1' && f.ratio !== '2:1') || f.amountL === undefined || !(f.amountL > 0)) return 0;
  const { sugarKg } = mixSyrup({ ratio: f.ratio, basis: f.basis ?? 'weight', finishedVolumeL: f.amountL });
  return sugarKg / SUGAR_KG_PER_HONEY_KG;
}

function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

/** True when the task's due date is before `today` (a task due today is not overdue). */
export function isOverdue(task: { dueDate: IsoDate }, today: IsoDate): boolean {
  return compareDates(task.dueDate, today) < 0;
}

/** A new array: overdue tasks first, then by due date, then by key (so the order is stable). */
export function sortTasks<T extends { dueDate: IsoDate; key: string }>(tasks: readonly T[], today: IsoDate): T[] {
  return [...tasks].sort((a, b) => {
    const overdue = Number(isOverdue(b, today)) - Number(isOverdue(a, today));
    if (overdue !== 0) return overdue;
    const byDate = compareDates(a.dueDate, b.dueDate);
    if (byDate !== 0) return byDate;
    return a.key < b.key ? -1 : a.key > b.key ? 1 : 0;
  });
}
