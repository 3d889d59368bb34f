/**
 * Cautions the record forms show where the work can hurt someone or break a rule. Each caution
 * defers to the product label and local rules; Frameside records and reminds, it never
 * prescribes. Pure: `cautionsFor(kind, input)` answers which cautions apply to a draft or a saved
 * record, so a form can show them while the keeper fills it in, and the server returns the same
 * ids in every record DTO (`cautions`).
 *
 * Sources (TRADE-REFERENCES.md):
 * - Foulbrood: PRODUCT.md §11 and common practice: American and European foulbrood are notifiable
 *   in many jurisdictions (e.g. the UK Bee Diseases and Pests Control Order, from memory); the
 *   keeper must not move frames or equipment and must tell the local bee inspector.
 * - Acid treatments: §4 "The label governs" (US EPA FIFRA advisory, primary; NBU "Medicines");
 *   oxalic-acid PPE (D. Cushman "Oxalic acid safety"; Tübingen exposure study: acid-resistant
 *   gloves, goggles, a respirator for vapour); formic-acid temperatures 10–30 °C and heat ≥ 33 °C
 *   in the first 3 days (R. Oliver, ABJ Sept 2022); thymol 15–30 °C (EU product label summary);
 *   supers: thymol and amitraz supers off, formic and hop beta acids supers may stay on, oxalic
 *   only with an amended label (§4, partly from memory: hence "check the label").
 * - Robbing: §2b Phillips (1919) "If robbing is likely to occur, feeding should be done in the
 *   evening"; §9 responses (no open or entrance feeding near the apiary; feed inside the hive).
 * - Stings: common practice (first-aid guidance): a reaction beyond local swelling (trouble
 *   breathing, swelling of the face or throat) is an emergency.
 */

export const CAUTION_IDS = ['notifiable-disease', 'acid-treatment', 'oxalic-vapour', 'treatment-temperature', 'treatment-supers', 'robbing', 'stings'] as const;
export type CautionId = (typeof CAUTION_IDS)[number];

export interface Caution {
  id: CautionId;
  /** A short heading, read first. */
  title: string;
  /** What to do, in plain sentences; every caution ends by deferring to the label or local rules. */
  lines: readonly string[];
  /** 'stop' when the keeper must act before anything else (notifiable disease, a sting reaction). */
  severity: 'stop' | 'care';
}

export const CAUTIONS: Readonly<Record<CautionId, Caution>> = {
  'notifiable-disease': {
    id: 'notifiable-disease',
    title: 'Suspected foulbrood: a notifiable disease',
    severity: 'stop',
    lines: [
      'Do not move frames, bees or equipment out of this hive or this apiary.',
      'Contact your local bee inspector (or the bee health authority) and tell them what you saw.',
      'Close the hive, clean your gloves and hive tool, and follow your local rules.',
    ],
  },
  'acid-treatment': {
    id: 'acid-treatment',
    title: 'Acid treatment: the label governs',
    severity: 'care',
    lines: [
      'Follow the product label (or its summary of product characteristics): it is the legal instruction for dose, timing and method.',
      'Wear acid-resistant gloves and goggles; keep water at hand to rinse skin or eyes.',
      'Use only products authorised where you keep bees, and follow your local rules.',
    ],
  },
  'oxalic-vapour': {
    id: 'oxalic-vapour',
    title: 'Oxalic acid vapour',
    severity: 'care',
    lines: [
      'Wear a respirator with acid-gas cartridges and a particle filter, goggles and acid-resistant gloves.',
      'Work outdoors, stand upwind, and keep other people and animals away while it vaporises.',
      'The label sets the dose and whether supers may be on.',
    ],
  },
  'treatment-temperature': {
    id: 'treatment-temperature',
    title: 'Temperature limits',
    severity: 'care',
    lines: [
      'Formic acid: apply when daytime highs are about 10–30 °C; heat of 33 °C or more in the first 3 days can harm the queen and brood.',
      'Thymol: works best at 20–25 °C; weaker below 15 °C; do not apply above 30 °C.',
      'Check the forecast against the temperatures on your product’s label.',
    ],
  },
  'treatment-supers': {
    id: 'treatment-supers',
    title: 'Honey supers and treatments',
    severity: 'care',
    lines: [
      'Thymol and amitraz: take honey supers off during treatment; put them back only after the label’s withdrawal time.',
      'Formic acid and hop beta acids: labels usually allow supers on; oxalic acid only where the label says so.',
      'Record when supers may go back on (withdrawal until) from the label.',
    ],
  },
  robbing: {
    id: 'robbing',
    title: 'Open feeding starts robbing',
    severity: 'care',
    lines: [
      'Feed inside the hive, in the evening, not in open dishes or at the entrance near the apiary.',
      'Clean up spilt syrup and honey; reduce entrances of weak colonies in a dearth.',
      'A forage dish test is set well away from the hives and taken in as soon as it is read.',
    ],
  },
  stings: {
    id: 'stings',
    title: 'Stings',
    severity: 'stop',
    lines: [
      'Scrape the sting out at once; local swelling and itching are common.',
      'If someone has a reaction beyond local swelling (trouble breathing, swelling of the face or throat, dizziness), call emergency services now.',
      'Keep your own emergency medicine with you if you have been prescribed one.',
    ],
  },
};

/** Active ingredients that are acids (PPE and label cautions). */
const ACIDS = new Set(['oxalic-acid', 'formic-acid']);
/** Ingredients whose labels set temperature limits Frameside knows to mention (TRADE-REFERENCES §4). */
const TEMPERATURE_BOUND = new Set(['formic-acid', 'thymol']);

/** The fields of a draft or record that decide its cautions; every field is optional so a half-filled form works. */
export interface CautionInput {
  diseaseSigns?: readonly string[] | null;
  temperament?: number | null;
  activeIngredient?: string | null;
  method?: string | null;
  supersOff?: boolean | null;
  /** A feeding's feeder type: 'entrance-feeder' counts as open-ish feeding near the hive. */
  feederType?: string | null;
  /** A forage check with a syrup dish (minutes or watched minutes given). */
  minutesToEmpty?: number | null;
  watchedMinutes?: number | null;
  untouched?: boolean | null;
  judgement?: string | null;
}

/**
 * Which cautions apply to a record of `kind`, given its (possibly partial) fields, in display
 * order. Inspection: suspected foulbrood → notifiable-disease; temperament 4–5 → stings.
 * Treatment: acids → acid-treatment; oxalic by vaporisation → oxalic-vapour; formic or thymol →
 * treatment-temperature; every treatment → treatment-supers. Feeding: always robbing (syrup and
 * feed draw robbers in a dearth). Forage check: a dish test or a dearth → robbing. Other kinds: none.
 */
export function cautionsFor(kind: string, input: CautionInput): CautionId[] {
  const out: CautionId[] = [];
  switch (kind) {
    case 'inspection':
      if (input.diseaseSigns?.includes('suspected-foulbrood')) out.push('notifiable-disease');
      if (typeof input.temperament === 'number' && input.temperament >= 4) out.push('stings');
      break;
    case 'treatment': {
      const ai = input.activeIngredient ?? '';
      if (ACIDS.has(ai)) out.push('acid-treatment');
      if (ai === 'oxalic-acid' && input.method === 'vaporisation') out.push('oxalic-vapour');
      if (TEMPERATURE_BOUND.has(ai)) out.push('treatment-temperature');
      if (ai) out.push('treatment-supers');
      break;
    }
    case 'feeding':
      out.push('robbing');
      break;
    case 'forage-check': {
      const dish = input.minutesToEmpty != null || input.watchedMinutes != null || input.untouched === true;
      if (dish || input.judgement === 'dearth') out.push('robbing');
      break;
    }
    default:
      break;
  }
  return out;
}
