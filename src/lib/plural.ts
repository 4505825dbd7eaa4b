const rules = new Intl.PluralRules('en');

/** The word that goes with a count: `plural(1, 'loan', 'loans')` is "loan", `plural(3, …)` is "loans". */
export function plural(count: number, one: string, other: string): string {
  return rules.select(count) === 'one' ? one : other;
}

/** A count with its word: "1 loan", "3 loans". */
export function countOf(count: number, one: string, other: string): string {
  return `${count} ${plural(count, one, other)}`;
}
