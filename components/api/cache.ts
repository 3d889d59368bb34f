/**
 * How long fetched data counts as fresh (`staleTime`) and how long unused data stays in memory
 * (`gcTime`), by kind. One table so screens never carry magic numbers.
 */
const SECOND = 1_000;
const MINUTE = 60 * SECOND;
/**
 * How long the device keeps what it fetched, in memory and in the persisted copy (components/offline):
 * a keeper who looked at the hives at home opens them hours later at an out-apiary with no signal.
 * gcTime must be at least the persisted copy's maxAge, or unused data is dropped from it.
 */
export const OFFLINE_KEEP_MS = 7 * 24 * 60 * MINUTE;

export const cacheLife = {
  /** Who is signed in: changes only on sign-in/out (which reset it) or a new invitation. */
  session: { staleTime: 5 * MINUTE, gcTime: OFFLINE_KEEP_MS },
  /** Lists another keeper may change while you look (apiaries, hives). */
  list: { staleTime: 30 * SECOND, gcTime: OFFLINE_KEEP_MS },
  /** One record being viewed or edited. */
  detail: { staleTime: 30 * SECOND, gcTime: OFFLINE_KEEP_MS },
} as const;
