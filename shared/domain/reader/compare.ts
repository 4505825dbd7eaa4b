/**
 * Like-for-like rules of the reader's compare page. Two published results compare only when they were measured
 * under the same load configuration (same CPU, settings, package power and soak) on the same test system (bench
 * profile: case, cooler, probe, room). Across roundups the room differs a little, so the compared figure is the rise
 * over ambient, not the absolute peak. Everything left out is listed with the reason, in words for the reader.
 */
export interface ComparableResult {
  productId: number;
  productName: string;
  roundupId: number;
  roundupTitle: string;
  /** ISO 8601: the newer of two results for the same board and load is the one compared. */
  publishedAt: string;
  benchProfileId: number | null;
  benchProfileName: string | null;
  configurationId: number;
  /** measured, or withheld (no figure the QA checks support). */
  status: 'measured' | 'withheld';
  deltaOverAmbientC: number | null;
}

export interface ComparedRow {
  result: ComparableResult;
}

export interface ExcludedProduct {
  productId: number;
  productName: string;
  reason: string;
}

export interface Comparison {
  rows: ComparableResult[];
  excluded: ExcludedProduct[];
  /** The test system the compared rows share; null when nothing compares. */
  benchProfileName: string | null;
  /** Why no chart can be drawn (fewer than two comparable boards), or null. */
  problem: string | null;
}

/**
 * Compares the chosen boards under one load configuration. `results` holds every published result of the chosen
 * boards (any configuration); `configurationNames` names each configuration for the reasons.
 */
export function compareLikeForLike(
  chosen: readonly { productId: number; productName: string }[],
  configurationId: number,
  results: readonly ComparableResult[],
  configurationNames: ReadonlyMap<number, string>,
): Comparison {
  const excluded: ExcludedProduct[] = [];
  const candidates: ComparableResult[] = [];
  const configurationName = configurationNames.get(configurationId) ?? 'this load configuration';
  for (const product of chosen) {
    const own = results.filter((r) => r.productId === product.productId);
    const underThis = own.filter((r) => r.configurationId === configurationId);
    if (underThis.length === 0) {
      const others = [...new Set(own.map((r) => configurationNames.get(r.configurationId)).filter(Boolean))];
      excluded.push({
        ...product,
        reason: others.length
          ? `Not tested under ${configurationName}; its published results are under ${others.join(', ')}, a different CPU load or settings, which would not be a fair comparison.`
          : 'No published result.',
      });
      continue;
    }
    const measured = underThis
      .filter((r) => r.status === 'measured' && r.deltaOverAmbientC !== null)
      .sort((a, b) => b.publishedAt.localeCompare(a.publishedAt));
    if (measured.length === 0) {
      excluded.push({
        ...product,
        reason: `No figure under ${configurationName}: the quality checks of its run did not support one.`,
      });
      continue;
    }
    candidates.push(measured[0]);
  }

  // The shared test system: the one most of the candidates were measured on (ties: the newest publication's).
  const counts = new Map<number | null, { count: number; newest: string }>();
  for (const candidate of candidates) {
    const entry = counts.get(candidate.benchProfileId) ?? { count: 0, newest: '' };
    entry.count++;
    if (candidate.publishedAt > entry.newest) entry.newest = candidate.publishedAt;
    counts.set(candidate.benchProfileId, entry);
  }
  const [profileId] = [...counts.entries()].sort(
    (a, b) => b[1].count - a[1].count || b[1].newest.localeCompare(a[1].newest),
  )[0] ?? [null];
  const rows: ComparableResult[] = [];
  for (const candidate of candidates) {
    if (candidate.benchProfileId === profileId) {
      rows.push(candidate);
      continue;
    }
    const shared = candidates.find((c) => c.benchProfileId === profileId);
    excluded.push({
      productId: candidate.productId,
      productName: candidate.productName,
      reason: `Measured on another test system (${candidate.benchProfileName ?? 'not recorded'}) than the others (${
        shared?.benchProfileName ?? 'not recorded'
      }): a different case, cooler or probe changes the temperatures, so the figures are not comparable.`,
    });
  }
  const problem =
    chosen.length < 2
      ? 'Choose at least two boards to compare.'
      : rows.length < 2
        ? 'Fewer than two of the chosen boards have comparable results under this load configuration.'
        : null;
  return {
    rows,
    excluded,
    benchProfileName: rows[0]?.benchProfileName ?? null,
    problem,
  };
}
