/**
 * How long fetched data counts as fresh (`staleTime`) and how long unused data stays in memory
 * (`gcTime`), by kind. One table so screens never carry magic numbers.
 */
const SECOND = 1_000;
const MINUTE = 60 * SECOND;

export const cacheLife = {
  /** Who is signed in: changes only on sign-in/out (which reset it) or a new invitation. */
  session: { staleTime: 5 * MINUTE, gcTime: 30 * MINUTE },
  /** Lists another keeper may change while you look (apiaries, hives). */
  list: { staleTime: 30 * SECOND, gcTime: 10 * MINUTE },
  /** One record being viewed or edited. */
  detail: { staleTime: 30 * SECOND, gcTime: 10 * MINUTE },
} as const;
