// The editor's recommendation labels (DESIGN.md, "Names of our own"): Benchwire's own list, strongest first.

export const editorialLabels = ['bench-pick', 'recommended', 'fine-at-stock', 'skip-for-overclocking'] as const;
export type EditorialLabel = (typeof editorialLabels)[number];

export const editorialLabelNames: Record<EditorialLabel, string> = {
  'bench-pick': 'Bench pick',
  recommended: 'Recommended',
  'fine-at-stock': 'Fine at stock',
  'skip-for-overclocking': 'Skip for overclocking',
};

/** Labels that recommend the board outright, for stock and overclocked use alike. */
export const recommendingLabels: readonly EditorialLabel[] = ['bench-pick', 'recommended'];
