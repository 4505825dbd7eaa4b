/** Every client URL in one place, so links and redirects cannot drift apart. */
export const paths = {
  dashboard: '/',
  users: '/users',
  account: '/account',
  catalog: '/catalog',
  catalogNew: '/catalog/new',
  catalogImport: '/catalog/import',
  catalogProduct: (id: number) => `/catalog/${id}`,
  catalogProductEdit: (id: number) => `/catalog/${id}/edit`,
  benches: '/benches',
  bench: (id: number) => `/benches/${id}`,
  logCheck: '/log-check',
  roundups: '/roundups',
  newRoundup: '/roundups/new',
  roundup: (id: number) => `/roundups/${id}`,
  writeUp: (roundupId: number) => `/roundups/${roundupId}/write-up`,
  writeUpSection: (roundupId: number, sectionId: number) => `/roundups/${roundupId}/write-up/${sectionId}`,
  /** The server-rendered stand-in of the public page, opened in its own tab. */
  writeUpPreview: (roundupId: number) => `/api/roundups/${roundupId}/write-up/preview`,
  roundupVerdicts: (id: number) => `/roundups/${id}/verdicts`,
  roundupCharts: (id: number) => `/roundups/${id}/charts`,
  roundupReadiness: (id: number) => `/roundups/${id}/readiness`,
  roundupCell: (roundupId: number, cellId: number) => `/roundups/${roundupId}/cells/${cellId}`,
  roundupEntryPhotos: (roundupId: number, entryId: number) => `/roundups/${roundupId}/products/${entryId}/photos`,
  myBench: '/my-bench',
  devInbox: '/dev-inbox',
  subscribers: '/subscribers',
  signIn: (next?: string) => (next && next !== '/' ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in'),
} as const;

/** Only a path on this site is an acceptable place to return to after signing in. */
export function safeNextPath(next: string | null | undefined): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return paths.dashboard;
  if (next.startsWith('/sign-in')) return paths.dashboard;
  return next;
}
