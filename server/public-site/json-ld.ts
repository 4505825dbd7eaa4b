import { minorUnitDigits } from '../../shared/domain/planning/money';
import type { PublishedProduct, PublishedRoundup } from './published-roundup';
import { absoluteUrl, type ReaderSite } from './render-layout';

/**
 * Editorial labels as a rating, best first (the design notes' label set). A label outside this list gets no rating:
 * JSON-LD then carries the review without reviewRating rather than an invented number.
 */
const labelRatings: Record<string, number> = {
  'Bench pick': 4,
  Recommended: 3,
  'Fine at stock': 2,
  'Skip for overclocking': 1,
};
const labelRatingScale = { best: 4, worst: 1 };

function ratingForLabel(label: string | null): number | null {
  if (!label) return null;
  return labelRatings[label.trim()] ?? null;
}

/**
 * schema.org Offer for the price at publication: `price` as a plain number with a full stop and the currency's
 * minor-unit digits (no symbol or thousands separator), `priceCurrency` as the ISO 4217 code. Benchwire does not
 * track stock, so `availability` is left out rather than guessed; none at all when no price was known.
 */
export function offerJsonLd(product: PublishedProduct, url: string) {
  const price = product.priceAtPublication;
  if (!price) return null;
  const digits = minorUnitDigits(price.currency);
  return {
    '@type': 'Offer',
    price: (price.amountMinor / 10 ** digits).toFixed(digits),
    priceCurrency: price.currency,
    url,
  };
}

/** The outlet as a schema.org Organization: author (and publisher) of every review. */
export function outletJsonLd(site: ReaderSite) {
  return { '@type': 'Organization', name: site.outletName, url: absoluteUrl(site, '/read') };
}

/** A board as a schema.org Product at its page's address, with its offer where a price was known. */
export function productNode(site: ReaderSite, product: PublishedProduct, offer: ReturnType<typeof offerJsonLd>) {
  return {
    '@type': 'Product',
    '@id': `${absoluteUrl(site, product.path)}#product`,
    name: product.name,
    brand: { '@type': 'Brand', name: product.maker },
    url: absoluteUrl(site, product.path),
    ...(offer ? { offers: offer } : {}),
  };
}

/** A Review's `reviewRating` for the editor's label, to spread into it; nothing for a label without a rating. */
export function reviewRatingJsonLd(label: string | null) {
  const rating = ratingForLabel(label);
  if (rating === null) return {};
  return {
    reviewRating: {
      '@type': 'Rating',
      ratingValue: rating,
      bestRating: labelRatingScale.best,
      worstRating: labelRatingScale.worst,
      ratingExplanation: label,
    },
  };
}

/**
 * schema.org for a results page: each tested board as a Product carrying our Review (author, date, URL), with a
 * reviewRating where the editor gave a label (schema.org Review and Product; REFERENCES.md "Web").
 */
export function roundupJsonLd(site: ReaderSite, model: PublishedRoundup) {
  const url = absoluteUrl(site, model.path);
  const outlet = outletJsonLd(site);
  return {
    '@context': 'https://schema.org',
    '@graph': model.products
      .filter((p) => p.kind === 'tested')
      .map((product) => ({
        ...productNode(site, product, offerJsonLd(product, absoluteUrl(site, product.path))),
        review: {
          '@type': 'Review',
          name: `${product.name} in ${model.headline}`,
          url: `${url}#board-${product.entryId}`,
          datePublished: model.publishedAt,
          dateModified: model.updatedAt,
          author: outlet,
          publisher: outlet,
          itemReviewed: { '@id': `${absoluteUrl(site, product.path)}#product` },
          ...reviewRatingJsonLd(product.label),
        },
      })),
  };
}
